package dev.terrace.core.fit;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.PriorSource;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * Turns the earlier campaigns a campaign names under {@code priors:} into Gaussian priors: each
 * earlier campaign is read with its own run log and fitted with its own models (and, in turn, its own
 * priors and, with {@code fit_offset: true}, its own fitted thermocouple offset), once per call, and every parameter it fitted with a 95 % interval becomes a prior on the
 * fitting scale ({@link ParameterPrior#fromInterval}). Two earlier series that fitted the same model
 * and parameter are combined by inverse variance. Held parameters (defaults) give no prior: a
 * published default is not knowledge of this chamber.
 *
 * <p>An earlier campaign file that is missing is reported by the campaign reader at its entry; a
 * cycle (A names B, B names A) is an error at the entry that closes it. A series reached twice through
 * different paths counts twice; name each earlier series once.
 *
 * @since 0.3
 */
public final class SeriesPriors {

    private SeriesPriors() {
    }

    /**
     * The priors and what was learned while building them.
     *
     * @param priors   one per model and parameter; never null, possibly empty
     * @param notes    remarks for the grower (material differences, series that fitted nothing); never null
     */
    public record Loaded(List<ParameterPrior> priors, List<String> notes) {
        /** Copies the lists. */
        public Loaded {
            priors = List.copyOf(priors);
            notes = List.copyOf(notes);
        }

        /** No priors. */
        public static final Loaded NONE = new Loaded(List.of(), List.of());
    }

    /**
     * Loads and fits the earlier campaigns of {@code c}.
     *
     * @param c        the campaign whose {@code priors:} to follow
     * @param registry the growth models
     * @param seed     the fits' seed
     * @return the priors; {@link Loaded#NONE} when the campaign names none
     * @throws InputException when an earlier campaign or run log has errors, or the priors form a cycle
     * @throws IOException    on other read failures
     */
    public static Loaded load(Campaign c, PluginRegistry registry, long seed) throws InputException, IOException {
        if (c.priors().isEmpty()) {
            return Loaded.NONE;
        }
        List<Path> chain = new ArrayList<>();
        chain.add(abs(c.file()));
        List<String> notes = new ArrayList<>();
        return new Loaded(load(c, registry, seed, chain, notes), notes);
    }

    private static List<ParameterPrior> load(Campaign c, PluginRegistry registry, long seed, List<Path> chain,
                                             List<String> notes) throws InputException, IOException {
        Map<String, ParameterPrior> combined = new LinkedHashMap<>();
        for (PriorSource ps : c.priors()) {
            Path f = abs(ps.file());
            if (chain.contains(f)) {
                List<String> names = new ArrayList<>();
                chain.subList(chain.indexOf(f), chain.size()).forEach(p -> names.add(p.toString()));
                names.add(f.toString());
                throw new InputException(Diagnostic.error(c.file(), ps.position().line(), ps.position().column(),
                        "priors form a cycle: " + String.join(" -> ", names)
                                + "; an earlier series cannot take its priors from a later one"));
            }
            LoadedCampaign earlier = LoadedCampaign.open(f, registry);
            chain.add(f);
            List<ParameterPrior> its = load(earlier.campaign(), registry, seed, chain, notes);
            chain.remove(chain.size() - 1);
            Campaign e = earlier.campaign();
            if (!Objects.equals(e.material().substrate(), c.material().substrate())
                    || !Objects.equals(e.material().deposit(), c.material().deposit())) {
                notes.add("prior series " + e.id() + " grew " + e.material().deposit() + " on " + e.material().substrate()
                        + ", this one " + c.material().deposit() + " on " + c.material().substrate()
                        + ": its parameters may not carry over");
            }
            // an earlier series that fits its own thermocouple offset is fitted at that offset, as its own
            // terrace fit would
            LoadedCampaign at = e.temperatureCalibration().fitOffset()
                    ? CampaignFit.withOffset(earlier, CampaignFit.profile(earlier, registry, seed, its).value())
                    : earlier;
            FitReport r = ModelFitter.fit(at, registry, seed, true, its);
            int before = combined.size();
            for (ModelFit mf : r.models()) {
                Optional<GrowthModel> gm = registry.model(mf.id());
                if (gm.isEmpty()) {
                    continue;
                }
                for (ModelParameter p : gm.get().parameters()) {
                    Estimate est = mf.estimates().stream().filter(x -> x.name().equals(p.name())).findFirst().orElse(null);
                    if (est == null || est.held() || p.isDiscrete() || !(est.hi() > est.lo())
                            || p.logScale() && !(est.lo() > 0)) {
                        continue;
                    }
                    Map<String, Double> rho = new LinkedHashMap<>();
                    int a = mf.correlationNames().indexOf(p.name());
                    for (int b = 0; a >= 0 && b < mf.correlationNames().size(); b++) {
                        double v = mf.correlations()[a][b];
                        if (b != a && Double.isFinite(v) && v != 0) {
                            rho.put(mf.correlationNames().get(b), v);
                        }
                    }
                    ParameterPrior pp = ParameterPrior.fromInterval(mf.id(), p.name(), p.unit(), p.logScale(),
                            est.value(), est.lo(), est.hi(), "series " + e.id() + " (" + ps.written() + ", "
                                    + mf.runsUsed() + " runs)", rho);
                    String key = mf.id() + "/" + p.name();
                    combined.merge(key, pp, ParameterPrior::combine);
                }
            }
            if (combined.size() == before) {
                notes.add("prior series " + e.id() + " (" + ps.written() + ") fitted no parameter this campaign's"
                        + " models share, so it adds nothing");
            }
        }
        return new ArrayList<>(combined.values());
    }

    private static Path abs(Path p) {
        return p.toAbsolutePath().normalize();
    }
}
