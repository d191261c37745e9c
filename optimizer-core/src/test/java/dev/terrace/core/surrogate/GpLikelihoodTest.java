package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;

class GpLikelihoodTest {

    @Test
    void gradientMatchesCentralDifferences() {
        // Gradient of R&W 2006 eq. 5.9 checked against central differences, step 1e-5 (common practice).
        SplittableRandom r = new SplittableRandom(11);
        int n = 30;
        int d = 3;
        int c = 2;
        double[][] f = new double[n][d + c];
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < d; k++) {
                f[i][k] = r.nextDouble();
            }
            f[i][d] = r.nextInt(2);
            f[i][d + 1] = r.nextInt(3);
            z[i] = Math.sin(5 * f[i][0]) + 0.5 * f[i][d] + 0.1 * r.nextGaussian();
        }
        GpLikelihood lik = new GpLikelihood(f, z, d, c);
        double[] theta = {Math.log(1.3), Math.log(0.3), Math.log(0.7), Math.log(2.0),
            GpKernel.logit(0.4), GpKernel.logit(0.8), Math.log(0.02)};
        double[] g = new double[theta.length];
        lik.value(theta, g);
        for (int q = 0; q < theta.length; q++) {
            double h = 1e-5;
            double[] up = theta.clone();
            double[] dn = theta.clone();
            up[q] += h;
            dn[q] -= h;
            double fd = (lik.value(up, null) - lik.value(dn, null)) / (2 * h);
            assertEquals(fd, g[q], 1e-6 * Math.max(1, Math.abs(fd)), "parameter " + q);
        }
    }

    @Test
    void valueEqualsTheModelsLogMarginalLikelihood() {
        // The search objective and the fitted model evaluate the same eq. 2.30 (R&W 2006).
        SplittableRandom r = new SplittableRandom(3);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[25];
        double[][] f = new double[25][];
        for (int i = 0; i < 25; i++) {
            x.add(new DesignPoint(new double[] {r.nextDouble(), r.nextDouble()}, new int[] {i % 2}));
            f[i] = GpKernel.encode(x.get(i));
            y[i] = Math.cos(3 * x.get(i).x(0)) - x.get(i).x(1) + 0.05 * r.nextGaussian();
        }
        GpHyperparameters h = new GpHyperparameters(0.9, new double[] {0.4, 1.1}, new double[] {0.6}, 0.003);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null, h, false);
        double v = new GpLikelihood(f, y, 2, 1).value(GpHyperparameterSearch.theta(h), null);
        assertEquals(gp.logMarginalLikelihood(), v, 1e-10);
    }
}
