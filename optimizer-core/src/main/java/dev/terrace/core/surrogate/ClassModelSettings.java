package dev.terrace.core.surrogate;

import java.util.List;
import java.util.Objects;

/**
 * Settings of the penalised logistic fits of {@link ClassModel} and {@link SuccessModel}: the
 * feature set, the grid of ridge strengths and how the strength is chosen by cross-validation.
 *
 * @param squaredTerms     whether to add a centred squared term per continuous coordinate
 * @param ridgeGrid        candidate ridge (L2) strengths &lambda;, each finite and &gt; 0; copied
 * @param folds            number of folds of the k-fold cross-validation, &ge; 2
 * @param leaveOneOutUpTo  up to this many labelled runs, leave-one-out replaces k-fold, &ge; 0
 * @since 0.1
 */
public record ClassModelSettings(boolean squaredTerms, List<Double> ridgeGrid, int folds, int leaveOneOutUpTo) {

    /**
     * Default ridge grid, &lambda; = 0.1 to 1000 in half-decade steps, on features scaled to
     * [&minus;1, 1] and 0/1 level indicators. The low end keeps a class never seen in a few dozen
     * runs from being driven to the probability floor; the high end leaves the prior (or base
     * rate) almost untouched by a few hundred runs [practice].
     */
    public static final List<Double> DEFAULT_RIDGE_GRID = List.of(0.1, 0.3, 1.0, 3.0, 10.0, 30.0, 100.0, 300.0, 1000.0);

    /** Default number of cross-validation folds, 5 [practice: 5- or 10-fold is the usual choice]. */
    public static final int DEFAULT_FOLDS = 5;

    /** Up to 20 labelled runs the ridge strength is chosen by leave-one-out instead [practice]. */
    public static final int DEFAULT_LEAVE_ONE_OUT_UP_TO = 20;

    /** Checks and copies. */
    public ClassModelSettings {
        Objects.requireNonNull(ridgeGrid, "ridgeGrid");
        ridgeGrid = List.copyOf(ridgeGrid);
        if (ridgeGrid.isEmpty()) {
            throw new IllegalArgumentException("ridge grid is empty");
        }
        for (Double l : ridgeGrid) {
            if (l == null || !(l > 0) || !Double.isFinite(l)) {
                throw new IllegalArgumentException("ridge strength must be finite and > 0: " + l);
            }
        }
        if (folds < 2) {
            throw new IllegalArgumentException("cross-validation needs at least 2 folds: " + folds);
        }
        if (leaveOneOutUpTo < 0) {
            throw new IllegalArgumentException("leaveOneOutUpTo must be >= 0: " + leaveOneOutUpTo);
        }
    }

    /** @return linear features only, the default grid, 5 folds, leave-one-out up to 20 runs; never null */
    public static ClassModelSettings defaults() {
        return new ClassModelSettings(false, DEFAULT_RIDGE_GRID, DEFAULT_FOLDS, DEFAULT_LEAVE_ONE_OUT_UP_TO);
    }

    /**
     * @param squared whether to add squared terms
     * @return these settings with the squared terms switched; never null
     */
    public ClassModelSettings withSquaredTerms(boolean squared) {
        return new ClassModelSettings(squared, ridgeGrid, folds, leaveOneOutUpTo);
    }

    /**
     * @param grid candidate ridge strengths, each finite and &gt; 0; never null
     * @return these settings with another grid; never null
     */
    public ClassModelSettings withRidgeGrid(List<Double> grid) {
        return new ClassModelSettings(squaredTerms, grid, folds, leaveOneOutUpTo);
    }
}
