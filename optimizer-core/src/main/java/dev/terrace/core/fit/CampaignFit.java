package dev.terrace.core.fit;

import dev.terrace.core.InputException;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.TemperatureCalibration;
import dev.terrace.core.campaign.TemperatureOffset;
import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.plugins.PluginRegistry;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.DoubleUnaryOperator;

/**
 * The whole fit of a campaign as {@code terrace fit} runs it: the earlier series' priors, the
 * thermocouple offset (from the calibration points, or fitted with them as its prior), the models'
 * fit, and for each prior the new runs' own estimate beside the combined one.
 *
 * <p><b>Fitted offset.</b> With {@code fit_offset: true} the offset δ is a campaign-wide parameter
 * shared by every model, so it is fitted by its profile likelihood: {@code D(δ) = Σ_models −2 ln L(δ)
 * + ((δ − δ_points)/u_points)²}, each term at the models' best parameters for that δ (fits without
 * intervals). The minimum is bracketed on a grid of {@link #GRID_POINTS} points over
 * δ_points ± {@link #GRID_HALF_WIDTH} u_points and refined by Brent's method; the 95 % interval is
 * where D rises {@value #CHI2_95} above its minimum (χ² with one degree of freedom), found by
 * bisection (profile-likelihood interval: Venzon and Moolgavkar, Appl. Stat. 37, 87 (1988), from
 * memory). The models' intervals are then those at the fitted offset: they do not include its
 * uncertainty.
 *
 * @param report      the models' fit (with the priors, at the applied offset); never null
 * @param offset      the offset applied; never null
 * @param priors      the earlier series' priors that applied; never null, possibly empty
 * @param checks      for each prior that entered a model's fit, its comparison; never null
 * @param notes       remarks about the priors; never null
 * @since 0.3
 */
public record CampaignFit(FitReport report, OffsetResult offset, List<ParameterPrior> priors, List<PriorCheck> checks,
                          List<String> notes) {

    /** Points of the profile's first grid. */
    public static final int GRID_POINTS = 9;
    /** Half-width of the profile's first grid, in standard uncertainties of the calibration offset. */
    public static final double GRID_HALF_WIDTH = 4;
    /** 95 % quantile of χ² with one degree of freedom, 3.841 (standard table). */
    public static final double CHI2_95 = 3.841;
    /** Bisection steps for each end of the interval (the bracket shrinks 256-fold). */
    static final int BISECTIONS = 8;
    /** Most grid extensions, each by the grid's half-width, when the interval is not closed inside the grid. */
    static final int MAX_EXTENSIONS = 3;

    /** Copies the lists. */
    public CampaignFit {
        Objects.requireNonNull(report, "report");
        Objects.requireNonNull(offset, "offset");
        priors = List.copyOf(priors);
        checks = List.copyOf(checks);
        notes = List.copyOf(notes);
    }

    /**
     * Fits a campaign with its priors and its temperature calibration.
     *
     * @param lc       the campaign and its runs
     * @param registry the growth models
     * @param seed     seed of the fits
     * @return the fit; never null
     * @throws InputException when an earlier campaign has errors or the priors form a cycle
     * @throws IOException    on other read failures of an earlier campaign
     */
    public static CampaignFit run(LoadedCampaign lc, PluginRegistry registry, long seed)
            throws InputException, IOException {
        SeriesPriors.Loaded loaded = SeriesPriors.load(lc.campaign(), registry, seed);
        List<ParameterPrior> priors = loaded.priors();
        TemperatureCalibration cal = lc.campaign().temperatureCalibration();
        OffsetResult offset = offset(lc, registry, seed, priors);
        LoadedCampaign at = withOffset(lc, offset.value());
        FitReport report = ModelFitter.fit(at, registry, seed, true, priors);
        List<PriorCheck> checks = new ArrayList<>();
        if (!priors.isEmpty()) {
            FitReport dataOnly = ModelFitter.fit(at, registry, seed, true, List.of());
            for (ParameterPrior p : priors) {
                Estimate combined = estimate(report, p);
                if (combined == null) {
                    continue;
                }
                checks.add(PriorCheck.of(p, estimate(dataOnly, p), combined));
            }
        }
        return new CampaignFit(report, offset, priors, checks, loaded.notes());
    }

    private static Estimate estimate(FitReport r, ParameterPrior p) {
        for (ModelFit f : r.models()) {
            if (f.id().equals(p.model())) {
                return f.estimates().stream().filter(e -> e.name().equals(p.parameter())).findFirst().orElse(null);
            }
        }
        return null;
    }

    /**
     * The campaign with its thermocouple offset as {@link #run} settles it: fitted by the profile
     * likelihood when the campaign asks for it ({@code fit_offset: true}), else from the calibration
     * points; the same offset then enters every prediction made with this campaign.
     *
     * @param lc       the campaign and the runs the offset is fitted on
     * @param registry the growth models
     * @param seed     seed of the fits
     * @param priors   the earlier series' priors; never null
     * @return the offset; never null
     */
    public static OffsetResult offset(LoadedCampaign lc, PluginRegistry registry, long seed,
                                      List<ParameterPrior> priors) {
        TemperatureCalibration cal = lc.campaign().temperatureCalibration();
        return cal.fitOffset() ? profile(lc, registry, seed, priors) : OffsetResult.fromPoints(cal.estimate());
    }

    /**
     * The campaign with a given offset applied to its substrate-temperature readings.
     *
     * @param lc      the campaign and its runs
     * @param offsetK the offset, K
     * @return the campaign with that offset; {@code lc} itself when nothing changes
     */
    public static LoadedCampaign withOffset(LoadedCampaign lc, double offsetK) {
        Campaign c = lc.campaign();
        if (!c.temperatureCalibration().estimate().isCalibrated() && offsetK == 0) {
            return lc;
        }
        Campaign c2 = c.withTemperatureCalibration(c.temperatureCalibration().withAppliedOffset(offsetK));
        return new LoadedCampaign(c2, lc.runLog(), lc.warnings());
    }

    /** −2 ln L of every model's selected candidate (priors on the parameters included). */
    static double minus2LogL(FitReport r) {
        double s = 0;
        for (ModelFit f : r.models()) {
            for (Candidate c : f.candidates()) {
                if (c.selected() && Double.isFinite(c.minus2LogL())) {
                    s += c.minus2LogL();
                }
            }
        }
        return s;
    }

    /** The profile-likelihood fit of the offset (see the class description). */
    static OffsetResult profile(LoadedCampaign lc, PluginRegistry registry, long seed, List<ParameterPrior> priors) {
        TemperatureOffset t = lc.campaign().temperatureCalibration().estimate();
        double mu = t.offsetK();
        double u = t.uncertaintyK();
        int[] evaluations = {0};
        DoubleUnaryOperator d = delta -> {
            evaluations[0]++;
            FitReport r = ModelFitter.fit(withOffset(lc, delta), registry, seed, false, priors);
            double z = (delta - mu) / u;
            return minus2LogL(r) + z * z;
        };
        double step = 2 * GRID_HALF_WIDTH * u / (GRID_POINTS - 1);
        double[] x = new double[GRID_POINTS];
        double[] y = new double[GRID_POINTS];
        int best = 0;
        for (int i = 0; i < GRID_POINTS; i++) {
            x[i] = mu - GRID_HALF_WIDTH * u + i * step;
            y[i] = d.applyAsDouble(x[i]);
            if (y[i] < y[best]) {
                best = i;
            }
        }
        double a = x[Math.max(best - 1, 0)];
        double b = x[Math.min(best + 1, GRID_POINTS - 1)];
        UnivariatePointValuePair opt = new BrentOptimizer(1e-8, 1e-2 * u).optimize(new MaxEval(40),
                new UnivariateObjectiveFunction(d::applyAsDouble), GoalType.MINIMIZE,
                new SearchInterval(a, b, x[best]));
        double dHat = opt.getValue() <= y[best] ? opt.getPoint() : x[best];
        double yHat = Math.min(opt.getValue(), y[best]);
        double limit = yHat + CHI2_95;
        double[] lo = end(d, dHat, -1, x, y, limit, GRID_HALF_WIDTH * u);
        double[] hi = end(d, dHat, +1, x, y, limit, GRID_HALF_WIDTH * u);
        String method = "fitted with the calibration points as its Gaussian prior (" + fmt(mu) + " +/- " + fmt(u)
                + " K); 95 % profile-likelihood interval over " + evaluations[0] + " model fits"
                + (lo[1] > 0 || hi[1] > 0 ? "; the interval reaches the edge of the search and is wider than shown" : "")
                + "; the models' intervals hold the offset at its fitted value";
        return new OffsetResult(t, true, dHat, lo[0], hi[0], method, evaluations[0]);
    }

    /** One end of the interval: {end, 1 when the search stopped at its edge without crossing}. */
    private static double[] end(DoubleUnaryOperator d, double dHat, int side, double[] x, double[] y, double limit,
                                double extension) {
        // the nearest grid point beyond dHat on this side whose value exceeds the limit
        double outside = Double.NaN;
        int n = x.length;
        for (int k = 0; k < n; k++) {
            int i = side > 0 ? k : n - 1 - k;
            if ((side > 0 ? x[i] > dHat : x[i] < dHat) && y[i] > limit) {
                outside = x[i];
                break;
            }
        }
        double edge = side > 0 ? x[n - 1] : x[0];
        for (int e = 0; Double.isNaN(outside) && e < MAX_EXTENSIONS; e++) {
            edge += side * extension;
            if (d.applyAsDouble(edge) > limit) {
                outside = edge;
            }
        }
        if (Double.isNaN(outside)) {
            return new double[] {edge, 1};
        }
        double inside = dHat;
        for (int k = 0; k < BISECTIONS; k++) {
            double mid = 0.5 * (inside + outside);
            if (d.applyAsDouble(mid) > limit) {
                outside = mid;
            } else {
                inside = mid;
            }
        }
        return new double[] {0.5 * (inside + outside), 0};
    }

    private static String fmt(double v) {
        return ModelFitter.fmt(v);
    }
}
