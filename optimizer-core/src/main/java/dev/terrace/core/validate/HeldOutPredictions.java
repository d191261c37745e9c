package dev.terrace.core.validate;

import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.surrogate.ClassModel;

import java.util.ArrayList;
import java.util.List;

import static dev.terrace.core.validate.FoldPredictions.nlpd;
import static dev.terrace.core.validate.FoldPredictions.unscaled;
import static dev.terrace.core.validate.Validation.Z90;

/**
 * The held-out predictions of one surrogate for one outcome, gathered fold by fold, and their
 * {@link Score}: RMSE, 90 % coverage and MSLL for numeric outcomes, log loss and accuracy for
 * classes (the metrics of {@link Validation}); and the parity points of the numeric ones.
 */
final class HeldOutPredictions {

    private final List<String> runIds = new ArrayList<>();
    private final List<double[]> numbers = new ArrayList<>();
    private final List<double[]> probs = new ArrayList<>();
    private final List<Integer> observed = new ArrayList<>();

    void addNumber(String runId, double y, double mu, double sd, double m0, double s0) {
        runIds.add(runId);
        numbers.add(new double[] {y, mu, sd, m0, s0});
    }

    void addClass(String runId, double[] p, int obs) {
        runIds.add(runId);
        probs.add(p.clone());
        observed.add(obs);
    }

    int size() {
        return runIds.size();
    }

    Score score(boolean cls) {
        int n = size();
        if (cls) {
            double ll = 0;
            int right = 0;
            for (int i = 0; i < n; i++) {
                double[] p = probs.get(i);
                int obs = observed.get(i);
                ll -= Math.log(Math.max(p[obs], ClassModel.PROBABILITY_FLOOR));
                int top = 0;
                for (int k = 1; k < p.length; k++) {
                    if (p[k] > p[top]) {
                        top = k;
                    }
                }
                if (top == obs) {
                    right++;
                }
            }
            return Score.classes(n, ll / n, (double) right / n);
        }
        double ss = 0;
        int inside = 0;
        double sll = 0;
        for (double[] v : numbers) {
            double e = v[0] - v[1];
            ss += e * e;
            if (Math.abs(e) <= Z90 * v[2]) {
                inside++;
            }
            sll += nlpd(v[0], v[1], v[2]) - nlpd(v[0], v[3], v[4]);
        }
        return Score.numeric(n, Math.sqrt(ss / n), (double) inside / n, sll / n);
    }

    List<ParityPoint> parity(String surrogate, OutcomeSpec o) {
        List<ParityPoint> out = new ArrayList<>();
        for (int i = 0; i < numbers.size(); i++) {
            double[] v = numbers.get(i);
            double meas = unscaled(o, v[0]);
            double pred = unscaled(o, v[1]);
            double lo = unscaled(o, v[1] - Z90 * v[2]);
            double hi = unscaled(o, v[1] + Z90 * v[2]);
            if (Double.isFinite(meas) && Double.isFinite(pred) && Double.isFinite(lo) && Double.isFinite(hi)) {
                out.add(new ParityPoint(surrogate, runIds.get(i), meas, pred, Math.min(lo, pred),
                        Math.max(hi, pred)));
            }
        }
        return out;
    }
}
