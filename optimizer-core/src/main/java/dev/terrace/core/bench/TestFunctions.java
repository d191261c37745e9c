package dev.terrace.core.bench;

/**
 * Standard global-optimisation test functions (minimisation form) used to check the search
 * core and the surrogate loop against published optima.
 *
 * <p>The set goes back to Dixon &amp; Szegő (eds), <i>Towards Global Optimisation 2</i>,
 * North-Holland 1978. The coefficients below were checked against the listings of Surjanovic
 * &amp; Bingham, <i>Virtual Library of Simulation Experiments</i> (VLSE), Simon Fraser University
 * (pages and MATLAB files {@code branin}, {@code hart3}, {@code hart6}).
 *
 * <p>All functions are pure and thread-safe; array arguments are read, never kept.
 *
 * @since 0.1
 */
public final class TestFunctions {

    /** Lower bound of Branin's x1 (Dixon &amp; Szegő 1978; VLSE). */
    public static final double BRANIN_X1_MIN = -5;
    /** Upper bound of Branin's x1 (Dixon &amp; Szegő 1978; VLSE). */
    public static final double BRANIN_X1_MAX = 10;
    /** Lower bound of Branin's x2 (Dixon &amp; Szegő 1978; VLSE). */
    public static final double BRANIN_X2_MIN = 0;
    /** Upper bound of Branin's x2 (Dixon &amp; Szegő 1978; VLSE). */
    public static final double BRANIN_X2_MAX = 15;

    /**
     * Global minimum of Branin, exactly 5/(4π) = 0.397887357729738...: at x1 = π the squared
     * bracket vanishes and cos π = −1, leaving s·t = 10/(8π). Published as 0.397887 (VLSE).
     */
    public static final double BRANIN_MINIMUM = 5.0 / (4.0 * Math.PI);

    /**
     * Global minimum of Hartmann-6 on [0,1]^6 as published, −3.32237 (Dixon &amp; Szegő 1978; VLSE).
     * The value at {@link #hartmann6Minimiser()} is −3.322368011391339.
     */
    public static final double HARTMANN6_MINIMUM = -3.32237;

    /**
     * Global minimum of Hartmann-3 on [0,1]^3 as published, −3.86278 (Dixon &amp; Szegő 1978;
     * VLSE). With the VLSE constant P[3][0] = 0.0381 used here the refined minimum is
     * −3.862779787332663.
     */
    public static final double HARTMANN3_MINIMUM = -3.86278;

    private static final double BRANIN_A = 1;
    private static final double BRANIN_B = 5.1 / (4 * Math.PI * Math.PI);
    private static final double BRANIN_C = 5 / Math.PI;
    private static final double BRANIN_R = 6;
    private static final double BRANIN_S = 10;
    private static final double BRANIN_T = 1 / (8 * Math.PI);

    /** Weights α of the four Hartmann terms (shared by Hartmann-3 and Hartmann-6). */
    private static final double[] HARTMANN_ALPHA = {1.0, 1.2, 3.0, 3.2};

    private static final double[][] HARTMANN3_A = {
        {3.0, 10, 30},
        {0.1, 10, 35},
        {3.0, 10, 30},
        {0.1, 10, 35},
    };

    /** VLSE hart3.m; the Hedar listing has P[3][0] = 0.03815 instead of 0.0381. */
    private static final double[][] HARTMANN3_P = {
        {0.3689, 0.1170, 0.2673},
        {0.4699, 0.4387, 0.7470},
        {0.1091, 0.8732, 0.5547},
        {0.0381, 0.5743, 0.8828},
    };

    private static final double[][] HARTMANN6_A = {
        {10, 3, 17, 3.5, 1.7, 8},
        {0.05, 10, 17, 0.1, 8, 14},
        {3, 3.5, 1.7, 10, 17, 8},
        {17, 8, 0.05, 10, 0.1, 14},
    };

    private static final double[][] HARTMANN6_P = {
        {0.1312, 0.1696, 0.5569, 0.0124, 0.8283, 0.5886},
        {0.2329, 0.4135, 0.8307, 0.3736, 0.1004, 0.9991},
        {0.2348, 0.1451, 0.3522, 0.2883, 0.3047, 0.6650},
        {0.4047, 0.8828, 0.8732, 0.5743, 0.1091, 0.0381},
    };

    private TestFunctions() {
    }

    /**
     * The Branin (Branin–Hoo) function
     * {@code a(x2 − b x1² + c x1 − r)² + s(1 − t)cos(x1) + s} with a = 1, b = 5.1/(4π²), c = 5/π,
     * r = 6, s = 10, t = 1/(8π).
     *
     * @param x1 first coordinate, usually in [−5, 10]
     * @param x2 second coordinate, usually in [0, 15]
     * @return the function value
     */
    public static double branin(double x1, double x2) {
        double bracket = x2 - BRANIN_B * x1 * x1 + BRANIN_C * x1 - BRANIN_R;
        return BRANIN_A * bracket * bracket + BRANIN_S * (1 - BRANIN_T) * Math.cos(x1) + BRANIN_S;
    }

    /**
     * @param x a point of length 2
     * @return {@link #branin(double, double)} at it
     */
    public static double branin(double[] x) {
        requireLength(x, 2);
        return branin(x[0], x[1]);
    }

    /**
     * @return the three global minimisers of Branin, (−π, 12.275), (π, 2.275), (3π, 2.475)
     *         (Dixon &amp; Szegő 1978; VLSE); a fresh array each call
     */
    public static double[][] braninMinimisers() {
        return new double[][] {{-Math.PI, 12.275}, {Math.PI, 2.275}, {3 * Math.PI, 2.475}};
    }

    /**
     * The Hartmann-6 function {@code −Σ_i α_i exp(−Σ_j A_ij (x_j − P_ij)²)} on [0, 1]^6.
     *
     * @param x a point of length 6
     * @return the function value
     */
    public static double hartmann6(double[] x) {
        requireLength(x, 6);
        return hartmann(x, HARTMANN6_A, HARTMANN6_P);
    }

    /**
     * @return the published global minimiser of Hartmann-6,
     *         (0.20169, 0.150011, 0.476874, 0.275332, 0.311652, 0.6573) (VLSE); a fresh array
     */
    public static double[] hartmann6Minimiser() {
        return new double[] {0.20169, 0.150011, 0.476874, 0.275332, 0.311652, 0.6573};
    }

    /**
     * The Hartmann-3 function {@code −Σ_i α_i exp(−Σ_j A_ij (x_j − P_ij)²)} on [0, 1]^3, with
     * the VLSE constants (P[3][0] = 0.0381).
     *
     * @param x a point of length 3
     * @return the function value
     */
    public static double hartmann3(double[] x) {
        requireLength(x, 3);
        return hartmann(x, HARTMANN3_A, HARTMANN3_P);
    }

    /**
     * @return the published global minimiser of Hartmann-3, (0.114614, 0.555649, 0.852547)
     *         (VLSE); a fresh array
     */
    public static double[] hartmann3Minimiser() {
        return new double[] {0.114614, 0.555649, 0.852547};
    }

    private static double hartmann(double[] x, double[][] a, double[][] p) {
        double sum = 0;
        for (int i = 0; i < HARTMANN_ALPHA.length; i++) {
            double inner = 0;
            for (int j = 0; j < x.length; j++) {
                double diff = x[j] - p[i][j];
                inner += a[i][j] * diff * diff;
            }
            sum += HARTMANN_ALPHA[i] * Math.exp(-inner);
        }
        return -sum;
    }

    private static void requireLength(double[] x, int n) {
        if (x.length != n) {
            throw new IllegalArgumentException("expected " + n + " coordinates, got " + x.length);
        }
    }
}
