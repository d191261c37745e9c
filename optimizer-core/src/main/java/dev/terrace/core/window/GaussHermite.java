package dev.terrace.core.window;

import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealVector;

import java.util.Arrays;

/**
 * Gauss–Hermite quadrature for expectations over a normal distribution:
 * E[f(X)] with X ~ N(0, sigma²) is approximated by sum_k w_k f(sigma z_k), exact for polynomials
 * of degree up to 2n − 1 (Abramowitz &amp; Stegun, Handbook of Mathematical Functions, 25.4.46,
 * there written for the weight exp(−x²); here rescaled to the standard normal density, whose
 * orthogonal polynomials are the probabilists' Hermite polynomials He_n).
 *
 * <p>Nodes and weights come from the Golub–Welsch algorithm (Golub &amp; Welsch, Math. Comp. 23,
 * 221–230, 1969): the nodes are the eigenvalues of the symmetric tridiagonal Jacobi matrix of the
 * three-term recurrence He_{k+1}(x) = x He_k(x) − k He_{k−1}(x) (zero diagonal, off-diagonal
 * sqrt(k), k = 1..n−1) and each weight is the squared first component of the normalised
 * eigenvector (the total mass of the standard normal density being 1).
 *
 * @param nodes   standardised nodes z_k in ascending order, symmetric about 0; copied
 * @param weights the weights w_k, positive and summing to 1; copied
 * @since 0.1
 */
public record GaussHermite(double[] nodes, double[] weights) {

    /** The largest number of nodes offered; beyond it the smallest weights underflow usefulness. */
    public static final int MAX_NODES = 40;

    /** Copies and checks the arrays. */
    public GaussHermite {
        nodes = nodes.clone();
        weights = weights.clone();
        if (nodes.length == 0 || nodes.length != weights.length) {
            throw new IllegalArgumentException("nodes and weights must be non-empty and of equal length");
        }
        for (int k = 0; k < nodes.length; k++) {
            if (!Double.isFinite(nodes[k]) || !(weights[k] > 0) || !Double.isFinite(weights[k])) {
                throw new IllegalArgumentException("nodes must be finite and weights positive");
            }
        }
    }

    /**
     * The n-point rule for the standard normal distribution.
     *
     * @param n number of nodes, 1 to {@link #MAX_NODES}
     * @return the rule; never null
     */
    public static GaussHermite standardNormal(int n) {
        if (n < 1 || n > MAX_NODES) {
            throw new IllegalArgumentException("Gauss-Hermite rule needs 1 to " + MAX_NODES + " nodes, found " + n);
        }
        if (n == 1) {
            return new GaussHermite(new double[] {0}, new double[] {1});
        }
        double[] main = new double[n];
        double[] off = new double[n - 1];
        for (int k = 1; k < n; k++) {
            off[k - 1] = Math.sqrt(k);
        }
        EigenDecomposition ed = new EigenDecomposition(main, off);
        double[] z = ed.getRealEigenvalues();
        double[] w = new double[n];
        Integer[] order = new Integer[n];
        for (int k = 0; k < n; k++) {
            RealVector v = ed.getEigenvector(k);
            double first = v.getEntry(0) / v.getNorm();
            w[k] = first * first;
            order[k] = k;
        }
        Arrays.sort(order, (a, b) -> Double.compare(z[a], z[b]));
        double[] zs = new double[n];
        double[] ws = new double[n];
        for (int k = 0; k < n; k++) {
            zs[k] = z[order[k]];
            ws[k] = w[order[k]];
        }
        // impose the exact symmetry of the rule (the eigen-solver leaves rounding-level asymmetry)
        for (int k = 0; k < n / 2; k++) {
            double node = (zs[n - 1 - k] - zs[k]) / 2;
            double weight = (ws[k] + ws[n - 1 - k]) / 2;
            zs[k] = -node;
            zs[n - 1 - k] = node;
            ws[k] = weight;
            ws[n - 1 - k] = weight;
        }
        if (n % 2 == 1) {
            zs[n / 2] = 0;
        }
        double sum = 0;
        for (double v : ws) {
            sum += v;
        }
        for (int k = 0; k < n; k++) {
            ws[k] /= sum;
        }
        return new GaussHermite(zs, ws);
    }

    /** @return the standardised nodes, ascending; a copy */
    @Override
    public double[] nodes() {
        return nodes.clone();
    }

    /** @return the weights; a copy */
    @Override
    public double[] weights() {
        return weights.clone();
    }

    /** @return number of nodes */
    public int size() {
        return nodes.length;
    }

    /**
     * @param k a node index
     * @return its standardised node
     */
    public double node(int k) {
        return nodes[k];
    }

    /**
     * @param k a node index
     * @return its weight
     */
    public double weight(int k) {
        return weights[k];
    }

    /**
     * @return the index of the node at exactly 0 (odd rules), or -1 for even rules
     */
    public int centreIndex() {
        return nodes.length % 2 == 1 ? nodes.length / 2 : -1;
    }

    /**
     * Approximates E[f(X)] for X ~ N(0, sigma²).
     *
     * @param f     the function
     * @param sigma the standard deviation, &ge; 0
     * @return the quadrature sum
     */
    public double expectation(java.util.function.DoubleUnaryOperator f, double sigma) {
        double s = 0;
        for (int k = 0; k < nodes.length; k++) {
            s += weights[k] * f.applyAsDouble(sigma * nodes[k]);
        }
        return s;
    }
}
