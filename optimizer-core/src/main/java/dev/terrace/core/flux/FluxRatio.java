package dev.terrace.core.flux;

import java.util.Objects;

/**
 * The ratio of two beam fluxes derived from their beam-equivalent pressures.
 *
 * @param moleculeRatio       J_a/J_b in molecules per molecule; positive and finite
 * @param atomRatio           the same ratio counted in atoms (the V/III atom ratio when a is the
 *                            group-V beam and b the group-III beam); positive and finite
 * @param relativeUncertainty the relative standard uncertainty of both ratios, in [0, 1), for
 *                            example 0.30 for an uncalibrated gauge
 * @param formula             the formula used, as text; never null
 * @since 0.1
 */
public record FluxRatio(double moleculeRatio, double atomRatio, double relativeUncertainty, String formula) {

    /** Checks the invariants. */
    public FluxRatio {
        Objects.requireNonNull(formula, "formula");
        if (!(moleculeRatio > 0) || !Double.isFinite(moleculeRatio) || !(atomRatio > 0) || !Double.isFinite(atomRatio)) {
            throw new IllegalArgumentException("flux ratios must be positive and finite, got " + moleculeRatio + " and " + atomRatio);
        }
        if (!(relativeUncertainty >= 0 && relativeUncertainty < 1)) {
            throw new IllegalArgumentException("relative uncertainty must lie in [0, 1), got " + relativeUncertainty);
        }
    }

    /** @return the atom ratio minus its uncertainty, atomRatio (1 - u); positive */
    public double atomRatioLow() {
        return atomRatio * (1 - relativeUncertainty);
    }

    /** @return the atom ratio plus its uncertainty, atomRatio (1 + u) */
    public double atomRatioHigh() {
        return atomRatio * (1 + relativeUncertainty);
    }
}
