package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class GpKernelTest {

    private static GpKernel kernel(double s2, double[] ell, double[] rho) {
        return GpKernel.of(new GpHyperparameters(s2, ell, rho, 0.0));
    }

    @Test
    void maternFiveHalvesMatchesTheMpmathCheckValue() {
        // Matern-5/2 ARD kernel, k = sigma_f^2 (1 + sqrt5 r + 5r^2/3) exp(-sqrt5 r) with
        // r^2 = sum_k (x_k - x'_k)^2 / l_k^2 (Rasmussen & Williams, Gaussian Processes for Machine
        // Learning, MIT Press 2006, eq. 4.17). x = (0.1, 0.2), x' = (0.4, 0.6), l = (0.5, 2.0),
        // sigma_f = 1: r = sqrt((0.3/0.5)^2 + (0.4/2)^2) = sqrt(0.36 + 0.04) = sqrt(0.4) = 0.6324555320336759;
        // M52 = 0.7490135404670807 (mpmath 1.3.0 at 40 digits, rounded to double).
        GpKernel k = kernel(1.0, new double[] {0.5, 2.0}, new double[0]);
        double[] x = {0.1, 0.2};
        double[] y = {0.4, 0.6};
        assertEquals(0.6324555320336759, k.scaledDistance(x, y), 1e-15, "r = sqrt(0.4)");
        assertEquals(0.7490135404670807, k.k(x, y), 1e-15, "M52, mpmath");
        assertEquals(0.7490135404670807, GpKernel.matern52(0.6324555320336759), 1e-15, "M52 of r");
    }

    @Test
    void signalVarianceScalesTheKernelAndIsItsValueAtZeroDistance() {
        // k = sigma_f^2 * M52(r) (Rasmussen & Williams 2006, eq. 4.17); M52 value from the test above (mpmath).
        GpKernel k = kernel(2.5, new double[] {0.5, 2.0}, new double[0]);
        assertEquals(2.5 * 0.7490135404670807, k.k(new double[] {0.1, 0.2}, new double[] {0.4, 0.6}), 1e-14);
        assertEquals(2.5, k.k(new double[] {0.3, 0.3}, new double[] {0.3, 0.3}), 0.0);
    }

    @Test
    void categoricalFactorIsOneForTheSameLevelAndRhoPerDifferingSetting() {
        // k = k_x * prod_j (1 if same level else rho_j): the exchangeable correlation of a qualitative
        // factor (Qian, Wu, Wu, Technometrics 50, 383 (2008); citation from memory), one rho per setting.
        GpKernel k = kernel(1.0, new double[] {0.5, 2.0}, new double[] {0.3, 0.6});
        double m52 = 0.7490135404670807;
        double[] a = GpKernel.encode(new DesignPoint(new double[] {0.1, 0.2}, new int[] {0, 2}));
        double[] same = GpKernel.encode(new DesignPoint(new double[] {0.4, 0.6}, new int[] {0, 2}));
        double[] first = GpKernel.encode(new DesignPoint(new double[] {0.4, 0.6}, new int[] {1, 2}));
        double[] both = GpKernel.encode(new DesignPoint(new double[] {0.4, 0.6}, new int[] {1, 0}));
        assertEquals(m52, k.k(a, same), 1e-15);
        assertEquals(0.3 * m52, k.k(a, first), 1e-15);
        assertEquals(0.3 * 0.6 * m52, k.k(a, both), 1e-15);
        assertEquals(0.3 * 0.6, k.k(a, GpKernel.encode(new DesignPoint(new double[] {0.1, 0.2}, new int[] {1, 0}))),
                1e-15, "same coordinates, both levels differ");
    }

    @Test
    void encodeLaysOutCoordinatesThenLevels() {
        assertArrayEquals(new double[] {0.25, 0.75, 3.0, 0.0},
                GpKernel.encode(new DesignPoint(new double[] {0.25, 0.75}, new int[] {3, 0})), 0.0);
    }

    @Test
    void kgDerivativesMatchCentralDifferences() {
        // Central finite differences with step 1e-6 in the log/logit parameters (common practice).
        GpKernel k = kernel(1.7, new double[] {0.3, 1.2, 0.8}, new double[] {0.4, 0.85});
        double[] x = GpKernel.encode(new DesignPoint(new double[] {0.1, 0.9, 0.5}, new int[] {0, 1}));
        double[] y = GpKernel.encode(new DesignPoint(new double[] {0.35, 0.4, 0.45}, new int[] {1, 1}));
        double[] g = k.kg(x, y);
        assertEquals(k.k(x, y), g[0], 1e-15);
        double[] p = k.hyperparameters();
        for (int q = 0; q < p.length; q++) {
            double h = 1e-6;
            double[] up = p.clone();
            double[] dn = p.clone();
            up[q] += h;
            dn[q] -= h;
            double fd = (k.of(up).k(x, y) - k.of(dn).k(x, y)) / (2 * h);
            assertEquals(fd, g[1 + q], 1e-8, "derivative " + q);
        }
    }

    @Test
    void hyperparametersRoundTripThroughOfAndIgnoreTheAppendedNoise() {
        GpKernel k = kernel(0.8, new double[] {0.2, 3.0}, new double[] {0.25});
        double[] p = k.hyperparameters();
        assertEquals(4, p.length);
        double[] withNoise = java.util.Arrays.copyOf(p, p.length + 1);
        withNoise[p.length] = 0.123;
        GpKernel back = k.of(withNoise);
        assertEquals(0.8, back.signalVariance(), 1e-14);
        assertArrayEquals(new double[] {0.2, 3.0}, back.lengthScales(), 1e-14);
        assertArrayEquals(new double[] {0.25}, back.rho(), 1e-14);
        assertEquals(p.length, k.lo().length);
        assertEquals(p.length, k.hi().length);
    }

    @Test
    void hyperparametersRejectRhoOfOneAndNonPositiveScales() {
        assertThrows(IllegalArgumentException.class,
                () -> new GpHyperparameters(1, new double[] {0.5}, new double[] {1.0}, 0.01));
        assertThrows(IllegalArgumentException.class,
                () -> new GpHyperparameters(1, new double[] {0.0}, new double[0], 0.01));
        assertThrows(IllegalArgumentException.class,
                () -> new GpHyperparameters(0, new double[] {0.5}, new double[0], 0.01));
        assertThrows(IllegalArgumentException.class,
                () -> new GpHyperparameters(1, new double[] {0.5}, new double[0], Double.NaN));
    }
}
