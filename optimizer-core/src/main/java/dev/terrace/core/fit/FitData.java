package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Excluded;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.runlog.Run;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * The data of one model's fit: the runs it uses, their conditions and observations, and how a
 * parameter vector maps to predictions. The layers above add the likelihood, the choice of free
 * parameters, the optimiser, the intervals and the report.
 */
abstract class FitData {
    final Campaign c;
    final GrowthModel model;
    final ModelChain upstream;
    final SplittableRandom rng;
    final List<Run> allRuns;
    final List<ModelParameter> params;
    final List<ModelParameter> continuous = new ArrayList<>();
    final List<ModelParameter> discrete = new ArrayList<>();
    final List<OutcomeSpec> outs = new ArrayList<>();
    final List<Run> used = new ArrayList<>();
    final List<Conditions> conds = new ArrayList<>();
    final List<Obs> obs = new ArrayList<>();
    final List<Excluded> excluded = new ArrayList<>();
    final List<String> numericOutcomes = new ArrayList<>();
    boolean hasClass;
    int maxEvaluations = 3000;
    boolean intervals = true;

    FitData(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        this.c = c;
        this.model = model;
        this.upstream = upstream;
        this.rng = rng;
        this.allRuns = runs;
        this.params = model.parameters();
        for (ModelParameter p : params) {
            (p.isDiscrete() ? discrete : continuous).add(p);
        }
        for (OutcomeSpec o : c.outcomes()) {
            if (o.role() != null && model.predictedOutcomes().contains(o.role())) {
                outs.add(o);
            }
        }
    }


    /** Picks the runs and observations; runs are checked at default parameters. */
    void collect(ParameterValues defaults) {
        ModelChain.Step step = new ModelChain.Step(model, defaults);
        ModelChain self = ModelChain.of(List.of(step), c.surface());
        for (Run r : allRuns) {
            if (!r.ok()) {
                continue;
            }
            boolean measured = false;
            for (OutcomeSpec o : outs) {
                if (o.isClass() ? r.category(o.name()).isPresent() : r.number(o.name()).isPresent()) {
                    measured = true;
                }
            }
            if (!measured) {
                excluded.add(new Excluded(r.runId(), "measured none of "
                        + String.join(", ", outs.stream().map(OutcomeSpec::name).toList())));
                continue;
            }
            Conditions cond = conditions(r);
            List<String> missing = new ArrayList<>();
            for (Role role : model.requiredInputs()) {
                if (!cond.has(role)) {
                    missing.add(role.key());
                }
            }
            if (!missing.isEmpty()) {
                excluded.add(new Excluded(r.runId(), "recipe does not give " + String.join(", ", missing)));
                continue;
            }
            Prediction p = self.safePredict(step, cond);
            if (!p.validity().valid()) {
                excluded.add(new Excluded(r.runId(), p.validity().reason()));
                continue;
            }
            int idx = used.size();
            used.add(r);
            conds.add(cond);
            for (OutcomeSpec o : outs) {
                if (o.isClass()) {
                    r.category(o.name()).ifPresent(v -> obs.add(new Obs(idx, o, Double.NaN, v)));
                } else {
                    var v = r.number(o.name());
                    if (v.isPresent() && (o.scale() != Scale.LOG || v.getAsDouble() > 0)) {
                        obs.add(new Obs(idx, o, scaled(o, v.getAsDouble()), null));
                    }
                }
            }
        }
        for (Obs o : obs) {
            if (o.isClass()) {
                hasClass = true;
            } else if (!numericOutcomes.contains(o.outcome().name())) {
                numericOutcomes.add(o.outcome().name());
            }
        }
    }

    /** Measured conditions of a run plus what upstream models predict for the roles it lacks. */
    Conditions conditions(Run r) {
        Conditions measured = RecipeConverter.conditions(c, r, true);
        // outcomes of this very model must not be inputs to it
        Conditions.Builder b = Conditions.builder();
        measured.numbers().forEach((role, v) -> {
            if (!model.predictedOutcomes().contains(role)) {
                b.set(role, v);
            }
        });
        measured.categories().forEach(b::set);
        Conditions base = b.build();
        if (upstream.steps().isEmpty()) {
            return base;
        }
        ModelChain.Result up = upstream.predict(base);
        Conditions.Builder b2 = Conditions.builder();
        base.numbers().forEach(b2::set);
        base.categories().forEach(b2::set);
        up.values().forEach((role, v) -> {
            if (!base.has(role) && !model.predictedOutcomes().contains(role)) {
                b2.set(role, v);
            }
        });
        return b2.build();
    }

    double scaled(OutcomeSpec o, double campaignValue) {
        return o.scale() == Scale.LOG ? Math.log10(campaignValue) : campaignValue;
    }

    double fromCanonical(OutcomeSpec o, double canonical) {
        return o.unit().fromCanonical(canonical, c.surface().monolayerHeightNm());
    }


    ParameterValues values(Map<String, Double> combo, List<ModelParameter> free, double[] u) {
        Map<String, Double> m = new LinkedHashMap<>();
        for (ModelParameter p : params) {
            m.put(p.name(), p.defaultValue());
        }
        m.putAll(combo);
        for (int i = 0; i < free.size(); i++) {
            ModelParameter p = free.get(i);
            m.put(p.name(), fromU(p, u[i]));
        }
        return new ParameterValues(m);
    }

    double toU(ModelParameter p, double v) {
        return p.logScale() ? Math.log10(v) : v;
    }

    double fromU(ModelParameter p, double u) {
        double v = p.logScale() ? Math.pow(10, u) : u;
        return Math.max(p.min(), Math.min(p.max(), v));
    }

    double uLo(ModelParameter p) {
        return toU(p, p.min());
    }

    double uHi(ModelParameter p) {
        return toU(p, p.max());
    }

    /** Predictions per used run. */
    Prediction[] predictAll(ParameterValues v) {
        ModelChain.Step step = new ModelChain.Step(model, v);
        ModelChain self = ModelChain.of(List.of(step), c.surface());
        Prediction[] out = new Prediction[used.size()];
        for (int i = 0; i < used.size(); i++) {
            out[i] = self.safePredict(step, conds.get(i));
        }
        return out;
    }

    /** Predicted value on the fitted scale, or NaN when not predicted/invalid. */
    double predictedScaled(Prediction p, OutcomeSpec o) {
        if (!p.validity().valid()) {
            return Double.NaN;
        }
        var v = p.value(o.role());
        if (v.isEmpty()) {
            return Double.NaN;
        }
        double inUnit = fromCanonical(o, v.getAsDouble());
        if (o.scale() == Scale.LOG) {
            return inUnit > 0 ? Math.log10(inUnit) : Double.NaN;
        }
        return inUnit;
    }

    double classProbability(Prediction p, OutcomeSpec o, String cls) {
        if (!p.validity().valid()) {
            return PROBABILITY_FLOOR;
        }
        Map<String, Double> probs = p.classProbabilities(o.role());
        double total = 0;
        for (String k : o.classes()) {
            total += Math.max(probs.getOrDefault(k, 0.0), PROBABILITY_FLOOR);
        }
        return Math.max(probs.getOrDefault(cls, 0.0), PROBABILITY_FLOOR) / total;
    }

}
