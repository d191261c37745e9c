package dev.terrace.core.fit;

import java.util.Objects;

/**
 * A Gaussian prior on one growth-model parameter, on the scale the fit works on: log10 of the value
 * for parameters fitted in log ({@code logScale}), the value itself otherwise.
 *
 * @param model     the growth-model id; never null
 * @param parameter the parameter name; never null
 * @param unit      the parameter's unit symbol, empty when dimensionless; never null
 * @param logScale  true when the parameter is fitted on log10
 * @param meanU     the prior mean on the fitting scale; finite
 * @param sdU       the prior standard deviation on the fitting scale; finite and positive
 * @param source    where the prior comes from (the earlier campaign and its runs); never null
 * @param correlations correlations with other prior parameters of the same model, from the earlier fit's
 *                  covariance (name to ρ); never null, possibly empty (uncorrelated)
 * @since 0.3
 */
public record ParameterPrior(String model, String parameter, String unit, boolean logScale, double meanU, double sdU,
                             String source, java.util.Map<String, Double> correlations) {

    /** z for a central 95 % interval of a normal distribution, 1.959964 (standard normal quantile). */
    public static final double Z95 = 1.959964;

    /** Checks the invariants. */
    public ParameterPrior {
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(parameter, "parameter");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(source, "source");
        correlations = FitResults.ordered(correlations);
        if (!Double.isFinite(meanU) || !(sdU > 0) || !Double.isFinite(sdU)) {
            throw new IllegalArgumentException("prior of " + parameter + " needs a finite mean and a positive sd");
        }
    }

    /**
     * A prior from a fitted value and its 95 % interval: the mean at the value, the sd a quarter of
     * the interval's width on the fitting scale divided by {@value #Z95}/2 (an asymmetric bootstrap
     * interval becomes its average half-width).
     *
     * @param model     the model id
     * @param parameter the parameter
     * @param unit      its unit
     * @param logScale  whether it is fitted on log10
     * @param value     the fitted value (positive when logScale)
     * @param lo        lower end of its 95 % interval
     * @param hi        upper end of its 95 % interval
     * @param source    where it comes from
     * @param correlations correlations with the model's other fitted parameters (name to ρ)
     * @return the prior; never null
     * @throws IllegalArgumentException when the interval is empty or not finite
     */
    public static ParameterPrior fromInterval(String model, String parameter, String unit, boolean logScale,
                                              double value, double lo, double hi, String source,
                                              java.util.Map<String, Double> correlations) {
        double u = toU(logScale, value);
        double sd = (toU(logScale, hi) - toU(logScale, lo)) / (2 * Z95);
        return new ParameterPrior(model, parameter, unit, logScale, u, sd, source, correlations);
    }

    /**
     * Inverse-variance combination of two priors on the same parameter (two earlier series). The
     * correlations of the two series are not combined: the result is uncorrelated with the others.
     *
     * @param other another prior of the same model and parameter
     * @return the combined prior; never null
     */
    public ParameterPrior combine(ParameterPrior other) {
        if (!other.model.equals(model) || !other.parameter.equals(parameter)) {
            throw new IllegalArgumentException("priors of different parameters cannot be combined");
        }
        double w1 = 1 / (sdU * sdU);
        double w2 = 1 / (other.sdU * other.sdU);
        return new ParameterPrior(model, parameter, unit, logScale, (w1 * meanU + w2 * other.meanU) / (w1 + w2),
                1 / Math.sqrt(w1 + w2), source + "; " + other.source, java.util.Map.of());
    }

    /** @return the prior mean in the parameter's unit */
    public double value() {
        return fromU(logScale, meanU);
    }

    /** @return the lower end of the prior's central 95 % interval, in the parameter's unit */
    public double lo() {
        return fromU(logScale, meanU - Z95 * sdU);
    }

    /** @return the upper end of the prior's central 95 % interval, in the parameter's unit */
    public double hi() {
        return fromU(logScale, meanU + Z95 * sdU);
    }

    static double toU(boolean log, double v) {
        return log ? Math.log10(v) : v;
    }

    static double fromU(boolean log, double u) {
        return log ? Math.pow(10, u) : u;
    }
}
