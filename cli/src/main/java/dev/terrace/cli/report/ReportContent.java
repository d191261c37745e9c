package dev.terrace.cli.report;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.fit.Arrhenius;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.propose.Proposals.ProposalSet;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Everything a campaign report shows, computed beforehand; {@link HtmlReport} only lays it out.
 * A part that could not be computed is null, and {@code problems} says why under the part's key
 * ({@link #FIT}, {@link #VALIDATION}, {@link #ARRHENIUS}, {@link #WINDOWS}, {@link #PROPOSALS}).
 *
 * @param loaded     the campaign and its run log; never null
 * @param generator  the program and version that made the report, for example "terrace 0.1.0"
 * @param seed       the seed of every random choice behind the report
 * @param date       the day the report was made; never null
 * @param fit        the growth-model fit with 95 % intervals, or null
 * @param validation how well the surrogates predict runs they were not trained on, or null
 * @param arrhenius  density against 1/kT, or null
 * @param windows    where the targets are met, one panel per pair of mapped settings; null when none
 * @param proposals  the proposed next runs, or null
 * @param problems   why a part is missing or incomplete, by part key; never null
 * @param trackRecord how past proposals came out, or null
 * @since 0.1
 */
public record ReportContent(LoadedCampaign loaded, String generator, long seed, LocalDate date, FitReport fit,
                            ValidationPanel validation, ArrheniusPanel arrhenius, List<WindowPanel> windows,
                            ProposalSet proposals, Map<String, String> problems, TrackRecordPanel trackRecord) {

    /**
     * A report without a track record.
     *
     * @param loaded     the campaign
     * @param generator  the program and version
     * @param seed       the seed
     * @param date       the day
     * @param fit        the fit, or null
     * @param validation the validation, or null
     * @param arrhenius  the Arrhenius plot, or null
     * @param windows    the window maps, or null
     * @param proposals  the proposals, or null
     * @param problems   why parts are missing
     */
    public ReportContent(LoadedCampaign loaded, String generator, long seed, LocalDate date, FitReport fit,
                         ValidationPanel validation, ArrheniusPanel arrhenius, List<WindowPanel> windows,
                         ProposalSet proposals, Map<String, String> problems) {
        this(loaded, generator, seed, date, fit, validation, arrhenius, windows, proposals, problems, null);
    }

    /** Key of the track record. */
    public static final String TRACK_RECORD = "track-record";

    /**
     * How the proposals grown so far came out.
     *
     * @param journal the journal file's name; never null
     * @param record  the grown proposals, predicted against measured; never null
     * @param figures one plot per numeric outcome with a prediction; never null
     */
    public record TrackRecordPanel(String journal, dev.terrace.core.journal.TrackRecord record, List<Figure> figures) {
        /** Checks and copies the contents. */
        public TrackRecordPanel {
            Objects.requireNonNull(journal, "journal");
            Objects.requireNonNull(record, "record");
            figures = List.copyOf(figures);
        }
    }

    /** Key of the growth-model fit. */
    public static final String FIT = "fit";
    /** Key of the validation. */
    public static final String VALIDATION = "validation";
    /** Key of the Arrhenius plot. */
    public static final String ARRHENIUS = "arrhenius";
    /** Key of the window maps. */
    public static final String WINDOWS = "windows";
    /** Key of the proposals. */
    public static final String PROPOSALS = "proposals";

    /** Checks and copies the contents. */
    public ReportContent {
        Objects.requireNonNull(loaded, "loaded");
        Objects.requireNonNull(generator, "generator");
        Objects.requireNonNull(date, "date");
        problems = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(problems));
        windows = windows == null ? null : List.copyOf(windows);
    }

    /**
     * Scores of one surrogate on one outcome, from runs it was not trained on.
     *
     * @param surrogate  which surrogate ("physics", "gp", "physics+gp")
     * @param n          runs scored
     * @param rmse       root-mean-square error on the outcome's scale (NaN when not applicable)
     * @param coverage90 fraction of measurements inside the 90 % interval (NaN when not applicable)
     * @param msll       mean standardised log loss (NaN when not applicable)
     * @param logLoss    mean -ln p(observed class) (NaN for numeric outcomes)
     * @param accuracy   fraction of runs whose most likely class was observed (NaN for numeric outcomes)
     */
    public record ScoreRow(String surrogate, int n, double rmse, double coverage90, double msll, double logLoss,
                           double accuracy) {
        /** Checks the invariants. */
        public ScoreRow {
            Objects.requireNonNull(surrogate, "surrogate");
            if (n < 0) {
                throw new IllegalArgumentException("negative count");
            }
        }
    }

    /**
     * Scores of every surrogate on one outcome.
     *
     * @param outcome the outcome column
     * @param scale   "log10", "linear" or "class"
     * @param rows    one row per surrogate
     */
    public record ScoreTable(String outcome, String scale, List<ScoreRow> rows) {
        /** Copies the rows. */
        public ScoreTable {
            Objects.requireNonNull(outcome, "outcome");
            Objects.requireNonNull(scale, "scale");
            rows = List.copyOf(rows);
        }
    }

    /**
     * The validation part.
     *
     * @param method  how the scores were obtained, in plain words
     * @param tables  one table per outcome
     * @param verdict plain-words conclusions
     * @param parity  measured-against-predicted figures
     */
    public record ValidationPanel(String method, List<ScoreTable> tables, List<String> verdict, List<Figure> parity) {
        /** Copies the lists. */
        public ValidationPanel {
            Objects.requireNonNull(method, "method");
            tables = List.copyOf(tables);
            verdict = List.copyOf(verdict);
            parity = List.copyOf(parity);
        }
    }

    /**
     * The Arrhenius part: ln(density) against 1/kT over the ok runs.
     *
     * @param density     the density outcome
     * @param temperature the substrate-temperature setting
     * @param fit         the straight-line fit
     * @param figure      the plot, or null when it could not be drawn
     */
    public record ArrheniusPanel(String density, String temperature, Arrhenius fit, Figure figure) {
        /** Checks the invariants. */
        public ArrheniusPanel {
            Objects.requireNonNull(density, "density");
            Objects.requireNonNull(temperature, "temperature");
            Objects.requireNonNull(fit, "fit");
        }
    }

    /**
     * The window-map part.
     *
     * @param x           setting on the horizontal axis
     * @param y           setting on the vertical axis
     * @param at          the recipe the other settings are held at, as "name value unit" texts
     * @param atSource    where that recipe comes from, in plain words
     * @param figures     the maps (without and with temperature uncertainty)
     * @param notes       what the maps found, in plain words
     */
    public record WindowPanel(String x, String y, List<String> at, String atSource, List<Figure> figures,
                              List<String> notes) {
        /** Copies the lists. */
        public WindowPanel {
            Objects.requireNonNull(x, "x");
            Objects.requireNonNull(y, "y");
            Objects.requireNonNull(atSource, "atSource");
            at = List.copyOf(at);
            figures = List.copyOf(figures);
            notes = List.copyOf(notes);
        }
    }
}
