package dev.terrace.core.surrogate;

import java.util.Objects;

/**
 * Scores of probabilistic class predictions such as those of {@link ClassModel} and
 * {@link SuccessModel}: mean log loss and expected calibration error.
 *
 * @since 0.1
 */
public final class ClassModelMetrics {

    private ClassModelMetrics() {
    }

    /**
     * Mean log loss &minus;(1/n)&Sigma; ln p<sub>i,y_i</sub> in nats, with probabilities floored
     * at {@link ClassModel#PROBABILITY_FLOOR}.
     *
     * @param probs  one probability row per case; never null
     * @param labels the observed class index per case; never null
     * @return the mean log loss, &ge; 0 (0 for no cases)
     */
    public static double logLoss(double[][] probs, int[] labels) {
        check(probs, labels);
        double s = 0;
        for (int i = 0; i < labels.length; i++) {
            s -= Math.log(Math.max(ClassModel.PROBABILITY_FLOOR, probs[i][labels[i]]));
        }
        return labels.length == 0 ? 0.0 : s / labels.length;
    }

    /**
     * Mean log loss of success probabilities.
     *
     * @param pSuccess  predicted success probability per case; never null
     * @param succeeded outcome per case; never null
     * @return the mean log loss, &ge; 0
     */
    public static double logLoss(double[] pSuccess, boolean[] succeeded) {
        return logLoss(twoColumns(pSuccess), labels(succeeded));
    }

    /**
     * Expected calibration error of the top-label confidence (Guo, Pleiss, Sun &amp; Weinberger
     * 2017, "On calibration of modern neural networks", <i>ICML</i>, PMLR 70:1321):
     * ECE = &Sigma;<sub>m</sub> (|B<sub>m</sub>|/n)&middot;|acc(B<sub>m</sub>) &minus; conf(B<sub>m</sub>)|,
     * where B<sub>m</sub> holds the cases whose largest predicted probability lies in
     * ((m &minus; 1)/M, m/M], acc is the fraction of them whose most probable class was observed
     * and conf their mean largest probability. Ties for the most probable class go to the lowest index.
     *
     * @param probs  one probability row per case; never null
     * @param labels the observed class index per case; never null
     * @param bins   number M of equal-width confidence bins, &ge; 1
     * @return the ECE, in [0, 1] (0 for no cases)
     */
    public static double expectedCalibrationError(double[][] probs, int[] labels, int bins) {
        check(probs, labels);
        if (bins < 1) {
            throw new IllegalArgumentException("need at least one bin: " + bins);
        }
        int n = labels.length;
        if (n == 0) {
            return 0.0;
        }
        double[] conf = new double[bins];
        double[] hits = new double[bins];
        int[] count = new int[bins];
        for (int i = 0; i < n; i++) {
            int top = 0;
            for (int c = 1; c < probs[i].length; c++) {
                if (probs[i][c] > probs[i][top]) {
                    top = c;
                }
            }
            double p = probs[i][top];
            int b = Math.min(bins - 1, Math.max(0, (int) Math.ceil(p * bins) - 1));
            conf[b] += p;
            hits[b] += top == labels[i] ? 1 : 0;
            count[b]++;
        }
        double ece = 0;
        for (int b = 0; b < bins; b++) {
            if (count[b] > 0) {
                ece += Math.abs(hits[b] - conf[b]) / n;
            }
        }
        return ece;
    }

    /**
     * Expected calibration error of success probabilities, as the two-class case of
     * {@link #expectedCalibrationError(double[][], int[], int)}.
     *
     * @param pSuccess  predicted success probability per case; never null
     * @param succeeded outcome per case; never null
     * @param bins      number of equal-width confidence bins, &ge; 1
     * @return the ECE, in [0, 1]
     */
    public static double expectedCalibrationError(double[] pSuccess, boolean[] succeeded, int bins) {
        return expectedCalibrationError(twoColumns(pSuccess), labels(succeeded), bins);
    }

    private static double[][] twoColumns(double[] p) {
        Objects.requireNonNull(p, "pSuccess");
        double[][] out = new double[p.length][];
        for (int i = 0; i < p.length; i++) {
            if (!(p[i] >= 0 && p[i] <= 1)) {
                throw new IllegalArgumentException("probability outside [0, 1]: " + p[i]);
            }
            out[i] = new double[] {1 - p[i], p[i]};
        }
        return out;
    }

    private static int[] labels(boolean[] s) {
        Objects.requireNonNull(s, "succeeded");
        int[] y = new int[s.length];
        for (int i = 0; i < s.length; i++) {
            y[i] = s[i] ? 1 : 0;
        }
        return y;
    }

    private static void check(double[][] probs, int[] labels) {
        Objects.requireNonNull(probs, "probs");
        Objects.requireNonNull(labels, "labels");
        if (probs.length != labels.length) {
            throw new IllegalArgumentException(probs.length + " probability rows but " + labels.length + " labels");
        }
        for (int i = 0; i < labels.length; i++) {
            if (labels[i] < 0 || labels[i] >= probs[i].length) {
                throw new IllegalArgumentException("label " + labels[i] + " outside the " + probs[i].length + " classes");
            }
        }
    }
}
