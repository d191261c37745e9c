package dev.terrace.core.fit;

import dev.terrace.spi.ParameterValues;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Value types of a growth-model fit. Grouped in one holder so the report types sit together.
 *
 * @since 0.1
 */
public final class FitResults {

    private FitResults() {
    }

    /**
     * An unmodifiable copy that iterates in the source's order. {@code Map.copyOf} would iterate in
     * an order that changes from one JVM run to the next, and the fit table and JSON list these maps.
     */
    static <K, V> Map<K, V> ordered(Map<K, V> m) {
        Map<K, V> copy = new LinkedHashMap<>();
        m.forEach((k, v) -> copy.put(Objects.requireNonNull(k), Objects.requireNonNull(v)));
        return Collections.unmodifiableMap(copy);
    }

    /**
     * One model parameter after the fit.
     *
     * @param name   parameter name
     * @param unit   unit symbol, empty when dimensionless
     * @param value  fitted value, or the default when held
     * @param lo     lower end of the 95 % interval (NaN when held)
     * @param hi     upper end of the 95 % interval (NaN when held)
     * @param held   true when the runs could not determine the parameter and it kept its default
     * @param reason why it was held, or how its interval was computed; never null
     * @param source where the default comes from; never null
     */
    public record Estimate(String name, String unit, double value, double lo, double hi, boolean held, String reason,
                           String source) {
        /** Checks the invariants. */
        public Estimate {
            Objects.requireNonNull(name);
            Objects.requireNonNull(unit);
            Objects.requireNonNull(reason);
            Objects.requireNonNull(source);
            if (!Double.isFinite(value)) {
                throw new IllegalArgumentException("estimate of " + name + " is not finite");
            }
        }
    }

    /**
     * A run left out of a model's fit.
     *
     * @param runId  the run
     * @param reason why, in plain words
     */
    public record Excluded(String runId, String reason) {
    }

    /** What a model's fit did with one run. */
    public enum RunUse {
        /** Its measured outcomes entered the fit. */
        USED,
        /** It entered the fit and at least one outcome was censored ({@code <X} or {@code >X}): Tobit terms. */
        CENSORED,
        /** It was left out; the status says why. */
        EXCLUDED;

        /** @return the lower-case word used in tables and JSON */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * The status of one run in one model's fit.
     *
     * @param runId  the run
     * @param use    used, censored or excluded
     * @param reason why excluded; for censored runs which cells were censored; for used runs an
     *               optional remark (empty when none); never null
     */
    public record RunStatus(String runId, RunUse use, String reason) {
        /** Checks the invariants. */
        public RunStatus {
            Objects.requireNonNull(runId);
            Objects.requireNonNull(use);
            Objects.requireNonNull(reason);
            if (use == RunUse.EXCLUDED && reason.isBlank()) {
                throw new IllegalArgumentException("excluded run " + runId + " needs a reason");
            }
        }
    }

    /**
     * One combination of discrete choices, fitted and scored.
     *
     * @param choices   the discrete values (for example critical_size 1, island_dimension 3), in the
     *                  model's declaration order
     * @param aicc      corrected Akaike information criterion, NaN when too few runs to compute it
     * @param minus2LogL  -2 ln L at the optimum
     * @param freeParameters number of fitted continuous parameters (plus one noise level per numeric outcome)
     * @param selected  true for the chosen combination
     */
    public record Candidate(Map<String, Double> choices, double aicc, double minus2LogL, int freeParameters,
                            boolean selected) {
        /** Copies the map, keeping its order (the model's declaration order of the discrete parameters). */
        public Candidate {
            choices = ordered(choices);
        }
    }

    /**
     * Residual of one run on one outcome.
     *
     * @param runId     the run
     * @param outcome   the outcome column
     * @param measured  measured value (campaign unit), NaN for class outcomes
     * @param predicted predicted value (campaign unit), NaN for class outcomes
     * @param residual  measured - predicted on the outcome's scale (log10 for log outcomes); for classes
     *                  -ln of the probability given to the observed class
     * @param observedClass the observed class of a class outcome, else null
     * @param censored  for a censored value ({@code measured} is then the bound): {@code "<"} or
     *                  {@code ">"}; else null. Its residual is bound − predicted.
     */
    public record Residual(String runId, String outcome, double measured, double predicted, double residual,
                           String observedClass, String censored) {
    }

    /**
     * How well one outcome is fitted.
     *
     * @param outcome  outcome column
     * @param scale    "log10", "linear" or "class"
     * @param n        number of runs that measured it (censored ones included)
     * @param rmse     root-mean-square residual on the scale over the measured values (NaN for classes)
     * @param logLoss  mean -ln p(observed class) (NaN for numeric)
     * @param accuracy fraction of runs whose most likely class was observed (NaN for numeric)
     * @param censored how many of the {@code n} values were censored (entered through Tobit terms)
     * @param sigma    fitted scatter on the scale (NaN for classes)
     */
    public record OutcomeFit(String outcome, String scale, int n, double rmse, double logLoss, double accuracy,
                             int censored, double sigma) {
    }

    /**
     * The fit of one growth model.
     *
     * @param id           model id
     * @param runsUsed     ok runs used
     * @param excluded     ok runs not used, with reasons
     * @param estimates    every parameter, in the model's order
     * @param selected     chosen values of discrete parameters, in the model's declaration order
     * @param candidates   every discrete combination tried
     * @param outcomes     per-outcome quality
     * @param residuals    per-run residuals
     * @param correlationNames names of the fitted parameters, in the order of {@code correlations}
     * @param correlations correlation matrix of the fitted parameters (empty when none was fitted)
     * @param values       the parameter values to predict with
     * @param verdict      plain-words summary lines
     * @param message      why nothing could be fitted, or empty
     * @param runs         every run of the log with its status in this fit, in log order
     */
    public record ModelFit(String id, int runsUsed, List<Excluded> excluded, List<Estimate> estimates,
                           Map<String, Double> selected, List<Candidate> candidates, List<OutcomeFit> outcomes,
                           List<Residual> residuals, List<String> correlationNames, double[][] correlations,
                           ParameterValues values, List<String> verdict, String message, List<RunStatus> runs) {
        /** Copies the contents. */
        public ModelFit {
            excluded = List.copyOf(excluded);
            runs = List.copyOf(runs);
            estimates = List.copyOf(estimates);
            selected = ordered(selected);
            candidates = List.copyOf(candidates);
            outcomes = List.copyOf(outcomes);
            residuals = List.copyOf(residuals);
            correlationNames = List.copyOf(correlationNames);
            double[][] c = new double[correlations.length][];
            for (int i = 0; i < c.length; i++) {
                c[i] = correlations[i].clone();
            }
            correlations = c;
            verdict = List.copyOf(verdict);
            Objects.requireNonNull(values);
            Objects.requireNonNull(message);
        }

        /**
         * @param use a status
         * @return how many runs have it
         */
        public int count(RunUse use) {
            return (int) runs.stream().filter(r -> r.use() == use).count();
        }

        /**
         * @param paramName a parameter
         * @param value     its new value
         * @param estimate  its new estimate
         * @return a copy with that parameter's value and estimate replaced (a shared parameter fitted in
         *         a later model of the chain); never null
         */
        public ModelFit withParameter(String paramName, double value, Estimate estimate) {
            List<Estimate> est = new java.util.ArrayList<>();
            for (Estimate e : estimates) {
                est.add(e.name().equals(paramName) ? estimate : e);
            }
            return new ModelFit(id, runsUsed, excluded, est, selected, candidates, outcomes, residuals,
                    correlationNames, correlations, values.with(paramName, value), verdict, message, runs);
        }

        /** @return true when at least one parameter was fitted */
        public boolean fittedAnything() {
            return estimates.stream().anyMatch(e -> !e.held());
        }

        /**
         * @param name a parameter name
         * @return its estimate
         */
        public Estimate estimate(String name) {
            return estimates.stream().filter(e -> e.name().equals(name)).findFirst()
                    .orElseThrow(() -> new IllegalArgumentException("no parameter " + name));
        }
    }

    /**
     * The fit of every model of a campaign.
     *
     * @param campaignId the campaign
     * @param runs       runs in the log
     * @param failedRuns failed runs (not used by any model fit)
     * @param models     one fit per campaign model, in chain order
     * @param seed       seed of the bootstrap and the multi-start
     */
    public record FitReport(String campaignId, int runs, int failedRuns, List<ModelFit> models, long seed) {
        /** Copies the list. */
        public FitReport {
            models = List.copyOf(models);
        }

        /** @return true when some model fitted some parameter */
        public boolean fittedAnything() {
            return models.stream().anyMatch(ModelFit::fittedAnything);
        }

        /**
         * @return the parameter values to predict with, by model id; never null
         */
        public Map<String, ParameterValues> values() {
            Map<String, ParameterValues> m = new java.util.LinkedHashMap<>();
            models.forEach(f -> m.put(f.id(), f.values()));
            return m;
        }
    }
}
