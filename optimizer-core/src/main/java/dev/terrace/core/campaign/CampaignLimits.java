package dev.terrace.core.campaign;

import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.linear.LinearConstraint;
import org.apache.commons.math3.optim.linear.LinearConstraintSet;
import org.apache.commons.math3.optim.linear.LinearObjectiveFunction;
import org.apache.commons.math3.optim.linear.NoFeasibleSolutionException;
import org.apache.commons.math3.optim.linear.Relationship;
import org.apache.commons.math3.optim.linear.SimplexSolver;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;

import static dev.terrace.core.campaign.YamlNodes.hint;
import static dev.terrace.core.campaign.YamlNodes.pos;

/**
 * Reads the {@code limits:} section of a campaign file for {@link CampaignReader}: each line parsed
 * by {@link LimitParser}, the settings it names checked against the declared ones, and the limits
 * checked to leave some point of the parameter boxes, alone and together.
 */
final class CampaignLimits {

    private final YamlNodes yaml;

    /** @param yaml the campaign file's nodes and problem list; never null */
    CampaignLimits(YamlNodes yaml) {
        this.yaml = yaml;
    }

    /**
     * Reads the limits. {@code declared} holds every parameter name written in the campaign, also
     * those whose declaration had an error: a limit naming one of those is left out quietly, as the
     * declaration's own error already says what to fix (one cause, one message).
     */
    List<LinearLimit> read(Node n, List<ParameterSpec> parameters, Set<String> declared) {
        List<LinearLimit> out = new ArrayList<>();
        if (!(n instanceof SequenceNode)) {
            yaml.error(n, "expected a list of limits such as '- anneal_temp >= substrate_temp'");
            return out;
        }
        Map<String, ParameterSpec> byName = new LinkedHashMap<>();
        parameters.forEach(p -> byName.put(p.name(), p));
        for (Node item : ((SequenceNode) n).getValue()) {
            if (!(item instanceof ScalarNode)) {
                yaml.error(item, "a limit is one line of text such as 'anneal_temp >= substrate_temp + 20'");
                continue;
            }
            String text = ((ScalarNode) item).getValue();
            LinearLimit limit;
            try {
                limit = LimitParser.parse(text, pos(item));
            } catch (LimitParser.LimitSyntaxException e) {
                yaml.error(item.getStartMark().getLine() + 1, item.getStartMark().getColumn() + 1 + e.offset,
                        "limit '" + text + "': " + e.getMessage()
                                + " (expected a linear inequality such as 'anneal_temp >= substrate_temp + 20')");
                continue;
            }
            boolean ok = true;
            for (String name : limit.coefficients().keySet()) {
                ParameterSpec p = byName.get(name);
                if (p == null && declared.contains(name)) {
                    ok = false; // the parameter's declaration is wrong and reported there
                } else if (p == null) {
                    int at = text.indexOf(name);
                    yaml.error(item.getStartMark().getLine() + 1, item.getStartMark().getColumn() + 1 + Math.max(at, 0),
                            "limit names unknown parameter '" + name + "'" + hint(name, byName.keySet()));
                    ok = false;
                } else if (p.isCategorical()) {
                    yaml.error(item, "limit names '" + name + "', which has choices; limits apply to numeric settings");
                    ok = false;
                }
            }
            if (ok) {
                out.add(limit);
            }
        }
        checkFeasible(out, byName);
        return out;
    }

    /** Reports limits that no point of the box satisfies, alone or together (linear programme). */
    private void checkFeasible(List<LinearLimit> limits, Map<String, ParameterSpec> byName) {
        if (limits.isEmpty()) {
            return;
        }
        boolean anyAlone = false;
        for (LinearLimit l : limits) {
            if (!feasibleAlone(l, byName)) {
                yaml.error(l.position(), "no setting inside the parameter boxes satisfies the limit '" + l.text()
                        + "'; widen the boxes or correct the limit");
                anyAlone = true;
            }
        }
        if (!anyAlone && limits.size() > 1 && !feasible(limits, byName)) {
            yaml.error(limits.get(0).position(), "the limits cannot all hold at once inside the parameter boxes: "
                    + limits.stream().map(LinearLimit::text).collect(Collectors.joining("; ")));
        }
    }

    /**
     * Whether some point of the box satisfies one limit {@code a·x + c >= 0}: its largest value over
     * the box is {@code c + Σ max(a_i min_i, a_i max_i)} (time and memory linear in the terms).
     */
    static boolean feasibleAlone(LinearLimit l, Map<String, ParameterSpec> byName) {
        double best = l.constant();
        double scale = Math.abs(l.constant());
        for (Map.Entry<String, Double> t : l.coefficients().entrySet()) {
            ParameterSpec p = byName.get(t.getKey());
            double a = t.getValue();
            double v = Math.max(a * p.min(), a * p.max());
            best += v;
            scale = Math.max(scale, Math.abs(v));
        }
        return best >= -1e-9 * Math.max(scale, 1);
    }

    /**
     * Whether some point of the box satisfies every limit at once (simplex). Only the settings the
     * limits name enter the programme, so its size follows the limits, not the parameter count.
     */
    static boolean feasible(List<LinearLimit> limits, Map<String, ParameterSpec> byName) {
        List<String> names = limits.stream().flatMap(l -> l.coefficients().keySet().stream()).distinct().toList();
        int d = names.size();
        if (d == 0) {
            return limits.stream().allMatch(l -> l.constant() >= 0);
        }
        List<LinearConstraint> cs = new ArrayList<>();
        for (int i = 0; i < d; i++) {
            double[] e = new double[d];
            e[i] = 1;
            ParameterSpec p = byName.get(names.get(i));
            cs.add(new LinearConstraint(e, Relationship.GEQ, p.min()));
            cs.add(new LinearConstraint(e.clone(), Relationship.LEQ, p.max()));
        }
        for (LinearLimit l : limits) {
            double[] a = new double[d];
            for (int i = 0; i < d; i++) {
                a[i] = l.coefficients().getOrDefault(names.get(i), 0.0);
            }
            cs.add(new LinearConstraint(a, Relationship.GEQ, -l.constant()));
        }
        try {
            new SimplexSolver().optimize(new MaxIter(10_000), new LinearObjectiveFunction(new double[d], 0),
                    new LinearConstraintSet(cs), GoalType.MINIMIZE,
                    new org.apache.commons.math3.optim.linear.NonNegativeConstraint(false));
            return true;
        } catch (NoFeasibleSolutionException e) {
            return false;
        } catch (RuntimeException e) {
            return true; // unbounded or iteration trouble: do not claim infeasibility
        }
    }
}
