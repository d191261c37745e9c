package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;

import java.util.Objects;

/**
 * Growth rate from RHEED intensity oscillations.
 *
 * <p>During layer-by-layer growth on a (001) zinc-blende surface the specular RHEED intensity
 * oscillates with a period equal to the time taken to grow one monolayer (a/2): Harris, Joyce
 * and Dobson, Surf. Sci. 103, L90 (1981); Wood, Surf. Sci. 108, L441 (1981); Neave, Joyce,
 * Dobson and Norton, Appl. Phys. A 31, 1 (1983) (citations from memory). So
 * rate (ML/s) = 1/T<sub>osc</sub>. The rule needs layer-by-layer growth: in step flow the
 * oscillations fade, and their period then no longer measures anything. Under group-III-limited
 * conditions (the usual As-rich growth) the rate measures the group-III flux that sticks.
 *
 * @since 0.1
 */
public final class RheedCalibration {

    /** The rule as text, for reports. */
    public static final String FORMULA =
            "ML/s = 1/T_osc (1 period = 1 ML = a/2 on (001)); nm/s = ML/s*a/2; um/h = nm/s*3.6; cm^-2 s^-1 = ML/s*2/a^2";

    private RheedCalibration() {
    }

    /**
     * Growth rate from one oscillation period.
     *
     * @param periodS  the oscillation period in s; positive and finite
     * @param compound the film being grown; never null
     * @return the growth rate; never null
     * @throws IllegalArgumentException when the period is not positive and finite
     */
    public static GrowthRate fromPeriod(double periodS, Compound compound) {
        Objects.requireNonNull(compound, "compound");
        if (!(periodS > 0) || !Double.isFinite(periodS)) {
            throw new IllegalArgumentException("RHEED period must be positive and finite (s), got " + periodS);
        }
        return GrowthRate.ofMonolayersPerSecond(1.0 / periodS, compound);
    }

    /**
     * Growth rate from a count of whole periods over a time span, for example from the first
     * to the eleventh maximum (10 periods). Counting many periods averages out the reading error
     * of each peak.
     *
     * @param periods  the number of whole periods in the span; at least 1
     * @param spanS    the time span in s; positive and finite
     * @param compound the film being grown; never null
     * @return the growth rate; never null
     * @throws IllegalArgumentException when the count or the span is out of range
     */
    public static GrowthRate fromPeriods(int periods, double spanS, Compound compound) {
        if (periods < 1) {
            throw new IllegalArgumentException("the number of RHEED periods must be at least 1, got " + periods);
        }
        if (!(spanS > 0) || !Double.isFinite(spanS)) {
            throw new IllegalArgumentException("time span must be positive and finite (s), got " + spanS);
        }
        return fromPeriod(spanS / periods, compound);
    }

    /**
     * Growth rate from the times of successive intensity maxima: the period is the least-squares
     * slope of peak time against peak number.
     *
     * @param peakTimesS the times of successive maxima in s, strictly increasing; at least two
     * @param compound   the film being grown; never null
     * @return the growth rate; never null
     * @throws IllegalArgumentException when fewer than two times are given or they do not increase
     */
    public static GrowthRate fromPeakTimes(double[] peakTimesS, Compound compound) {
        Objects.requireNonNull(peakTimesS, "peakTimesS");
        int n = peakTimesS.length;
        if (n < 2) {
            throw new IllegalArgumentException("at least two peak times are needed, got " + n);
        }
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(peakTimesS[i]) || (i > 0 && !(peakTimesS[i] > peakTimesS[i - 1]))) {
                throw new IllegalArgumentException("peak times must be finite and strictly increasing");
            }
        }
        double meanIndex = (n - 1) / 2.0;
        double meanTime = 0;
        for (double t : peakTimesS) {
            meanTime += t / n;
        }
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < n; i++) {
            sxy += (i - meanIndex) * (peakTimesS[i] - meanTime);
            sxx += (i - meanIndex) * (i - meanIndex);
        }
        return fromPeriod(sxy / sxx, compound);
    }
}
