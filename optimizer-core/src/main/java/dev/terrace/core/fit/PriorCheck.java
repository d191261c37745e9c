package dev.terrace.core.fit;

import java.util.Objects;

/**
 * One parameter with a prior from an earlier series: the prior, the new runs' own estimate (the fit
 * without any prior), the combined estimate (the fit with the priors), and whether the two disagree.
 *
 * <p><b>Conflict rule.</b> If the earlier series and the new runs measure the same quantity, the
 * difference of their estimates on the fitting scale, divided by the combined standard deviation
 * {@code sqrt(sd_prior² + sd_data²)}, is about standard normal; {@code |z| >} {@value #CONFLICT_Z}
 * happens by chance in 0.27 % of cases, so it is flagged as a prior the new runs contradict (a check
 * of the prior against the data in the spirit of Box, J. R. Stat. Soc. A 143, 383 (1980), and Evans
 * and Moshonov, Bayesian Analysis 1, 893 (2006); from memory). When the new runs cannot estimate the
 * parameter on their own, no conflict can be told and {@code z} is NaN.
 *
 * @param model      the model id; never null
 * @param prior      the prior; never null
 * @param dataValue  the new runs' own estimate (NaN when they could not fit it alone)
 * @param dataLo     its 95 % interval, lower end (NaN when not fitted)
 * @param dataHi     its 95 % interval, upper end (NaN when not fitted)
 * @param value      the combined estimate
 * @param lo         its 95 % interval, lower end (NaN when held)
 * @param hi         its 95 % interval, upper end (NaN when held)
 * @param z          (data − prior) / combined sd on the fitting scale, NaN when the data alone gave no estimate
 * @since 0.3
 */
public record PriorCheck(String model, ParameterPrior prior, double dataValue, double dataLo, double dataHi,
                         double value, double lo, double hi, double z) {

    /** |z| above which a prior counts as contradicted by the new runs: 3 (see the class description). */
    public static final double CONFLICT_Z = 3;

    /** Checks the invariants. */
    public PriorCheck {
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(prior, "prior");
    }

    /**
     * Compares a prior with the fits without and with it.
     *
     * @param prior    the prior
     * @param data     the parameter in the fit without priors (null when absent)
     * @param combined the parameter in the fit with priors (null when absent)
     * @return the check; never null
     */
    public static PriorCheck of(ParameterPrior prior, FitResults.Estimate data, FitResults.Estimate combined) {
        boolean dataFitted = data != null && !data.held() && data.hi() > data.lo()
                && (!prior.logScale() || data.lo() > 0);
        double z = Double.NaN;
        if (dataFitted) {
            double u = ParameterPrior.toU(prior.logScale(), data.value());
            double sd = (ParameterPrior.toU(prior.logScale(), data.hi()) - ParameterPrior.toU(prior.logScale(), data.lo()))
                    / (2 * ParameterPrior.Z95);
            z = (u - prior.meanU()) / Math.sqrt(sd * sd + prior.sdU() * prior.sdU());
        }
        double v = combined == null ? prior.value() : combined.value();
        boolean held = combined == null || combined.held();
        return new PriorCheck(prior.model(), prior, dataFitted ? data.value() : Double.NaN,
                dataFitted ? data.lo() : Double.NaN, dataFitted ? data.hi() : Double.NaN, v,
                held ? Double.NaN : combined.lo(), held ? Double.NaN : combined.hi(), z);
    }

    /** @return true when the new runs contradict the prior ({@code |z| >} {@value #CONFLICT_Z}) */
    public boolean conflict() {
        return Double.isFinite(z) && Math.abs(z) > CONFLICT_Z;
    }
}
