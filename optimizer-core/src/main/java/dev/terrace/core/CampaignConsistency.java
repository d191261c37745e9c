package dev.terrace.core;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.Role;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * Problems that neither file shows alone but that later commands trip over: a setting no run
 * records, a growth model that needs a role no setting, outcome or other model provides, and a
 * campaign without targets. Each becomes one warning that names the column, role or key and says
 * what to do, so {@code check} is the gate before a fit.
 *
 * @since 0.2
 */
public final class CampaignConsistency {

    private CampaignConsistency() {
    }

    /**
     * @param campaign the campaign; never null
     * @param log      its run log; never null
     * @param registry the growth models, or null to skip the model checks
     * @return the warnings, possibly empty; never null
     */
    public static List<Diagnostic> warnings(Campaign campaign, RunLog log, PluginRegistry registry) {
        Objects.requireNonNull(campaign, "campaign");
        Objects.requireNonNull(log, "log");
        List<Diagnostic> out = new ArrayList<>();
        if (!log.runs().isEmpty()) {
            for (ParameterSpec p : campaign.parameters()) {
                boolean recorded = log.runs().stream().anyMatch(r -> p.isCategorical()
                        ? r.category(p.name()).isPresent() : r.number(p.name()).isPresent());
                if (!recorded) {
                    out.add(Diagnostic.warning(log.file(), 1, 1, "no run records setting '" + p.name()
                            + "' (the run log has no such column, or it is empty): runs without it cannot"
                            + " train the surrogate or be validated; add the column with the value each run used"));
                }
            }
        }
        if (registry != null) {
            Set<Role> available = EnumSet.noneOf(Role.class);
            campaign.parameters().forEach(p -> p.roleIfAny().ifPresent(available::add));
            campaign.outcomes().stream().map(OutcomeSpec::role).filter(Objects::nonNull).forEach(available::add);
            if (available.contains(Role.GROUP_V_BEP)) {
                available.add(Role.GROUP_V_FLUX); // converted from the gauge reading (see RecipeConverter)
            }
            List<GrowthModel> chain = new ArrayList<>();
            for (String id : campaign.models()) {
                registry.model(id).ifPresent(chain::add);
            }
            chain.forEach(m -> available.addAll(m.predictedOutcomes()));
            for (String id : campaign.models()) {
                Optional<GrowthModel> m = registry.model(id);
                if (m.isEmpty()) {
                    continue; // an unknown id is the campaign reader's error
                }
                for (Role need : m.get().requiredInputs()) {
                    if (!available.contains(need)) {
                        out.add(Diagnostic.warning(campaign.file(), 0, 0, "growth model '" + id + "' needs a "
                                + (need.kind() == Role.Kind.SETTING ? "setting" : "value") + " with role '"
                                + need.key() + "', and no setting, outcome or other model gives one: add"
                                + " 'role: " + need.key() + "' to the setting that holds it, or remove '" + id
                                + "' from models (until then its fit has nothing to work with)"));
                    }
                }
            }
        }
        if (campaign.targets().isEmpty() && !campaign.outcomes().isEmpty()) {
            out.add(Diagnostic.warning(campaign.file(), 0, 0, "the campaign states no targets, so a proposal's"
                    + " yield is only the chance that the run succeeds, not of meeting a spec; add targets such as '"
                    + example(campaign) + "'"));
        }
        return out;
    }

    private static String example(Campaign campaign) {
        OutcomeSpec o = campaign.outcomes().get(0);
        if (o.isClass()) {
            return o.name() + ": {is: " + o.classes().get(0) + "}";
        }
        return o.name() + ": {min: ..., max: ...}";
    }
}
