package dev.terrace.core.campaign;

import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static dev.terrace.core.campaign.YamlNodes.fmt;
import static dev.terrace.core.campaign.YamlNodes.hint;
import static dev.terrace.core.campaign.YamlNodes.pos;

/**
 * Reads the {@code targets:} section of a campaign file for {@link CampaignReader}: a window
 * ({@code min}, {@code max}) or an objective ({@code maximize}/{@code minimize}: at most one) on a
 * numeric outcome, {@code is: <class>} on a class outcome, each problem reported once at its node.
 */
final class CampaignTargets {

    private static final List<String> TARGET_KEYS = List.of("min", "max", "is", "maximize", "minimize");

    private final YamlNodes yaml;

    /** @param yaml the campaign file's nodes and problem list; never null */
    CampaignTargets(YamlNodes yaml) {
        this.yaml = yaml;
    }

    /**
     * @param n        the {@code targets:} node
     * @param outcomes the declared outcomes (those whose declaration failed are absent)
     * @return the targets without errors; never null
     */
    List<Target> read(Node n, List<OutcomeSpec> outcomes) {
        List<Target> out = new ArrayList<>();
        if (!(n instanceof MappingNode)) {
            yaml.error(n, "expected a mapping of outcome names to {min, max} or {is: class}");
            return out;
        }
        Map<String, OutcomeSpec> byName = new LinkedHashMap<>();
        outcomes.forEach(o -> byName.put(o.name(), o));
        Map<String, NodeTuple> entries = yaml.entries((MappingNode) n, null, "target");
        String objectiveSeen = null;
        for (Map.Entry<String, NodeTuple> e : entries.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            OutcomeSpec o = byName.get(name);
            if (o == null) {
                yaml.error(key, "target on '" + name + "', which is not a declared outcome" + hint(name, byName.keySet()));
                continue;
            }
            if (!(body instanceof MappingNode)) {
                yaml.error(body, "target '" + name + "' expects {min: ..., max: ...} or {is: ...}");
                continue;
            }
            Map<String, NodeTuple> m = yaml.entries((MappingNode) body, TARGET_KEYS, "target key");
            if (o.isClass()) {
                for (String k : List.of("min", "max")) {
                    if (m.containsKey(k)) {
                        yaml.error(m.get(k).getKeyNode(), "'" + name + "' is a class outcome: use is: <class>, not " + k);
                    }
                }
                String is = yaml.scalarText(m, "is", body, true);
                if (is != null && !o.classes().contains(is)) {
                    yaml.error(m.get("is").getValueNode(), "'" + is + "' is not a class of '" + name + "'; expected one of "
                            + String.join(", ", o.classes()) + hint(is, o.classes()));
                } else if (is != null) {
                    out.add(new Target(name, Double.NaN, Double.NaN, is, pos(key)));
                }
                continue;
            }
            if (m.containsKey("is")) {
                yaml.error(m.get("is").getKeyNode(), "'" + name + "' is numeric: use min and/or max, not is");
                continue;
            }
            Target.Goal goal = Target.Goal.WINDOW;
            boolean goalOk = true;
            for (String k : List.of("maximize", "minimize")) {
                if (!m.containsKey(k)) {
                    continue;
                }
                String v = yaml.scalar(m.get(k).getValueNode(), k);
                if ("true".equals(v)) {
                    if (goal != Target.Goal.WINDOW) {
                        yaml.error(m.get(k).getKeyNode(), "target '" + name + "' cannot both maximize and minimize");
                        goalOk = false;
                    }
                    goal = k.equals("maximize") ? Target.Goal.MAXIMIZE : Target.Goal.MINIMIZE;
                } else if (!"false".equals(v)) {
                    yaml.error(m.get(k).getValueNode(), k + " expects true or false, found '" + v + "'");
                    goalOk = false;
                }
            }
            if (!goalOk) {
                continue;
            }
            Double min = m.containsKey("min") ? yaml.number(m, "min", body, name) : Double.valueOf(Double.NaN);
            Double max = m.containsKey("max") ? yaml.number(m, "max", body, name) : Double.valueOf(Double.NaN);
            if (min == null || max == null) {
                continue;
            }
            if (min.isNaN() && max.isNaN() && goal == Target.Goal.WINDOW) {
                yaml.error(body, "target '" + name + "' needs min, max or both (or maximize: true / minimize: true)");
                continue;
            }
            if (goal != Target.Goal.WINDOW && objectiveSeen != null) {
                yaml.error(key, "only one target may maximize or minimize; '" + objectiveSeen + "' already does");
                continue;
            }
            if (goal != Target.Goal.WINDOW) {
                objectiveSeen = name;
            }
            if (!min.isNaN() && !max.isNaN() && !(min < max)) {
                yaml.error(m.get("min").getValueNode(), "target min (" + fmt(min) + ") must be below max (" + fmt(max) + ")");
                continue;
            }
            if (o.scale() == Scale.LOG && ((!min.isNaN() && min <= 0) || (!max.isNaN() && max <= 0))) {
                yaml.error(body, "'" + name + "' has scale: log, so its target bounds must be positive");
                continue;
            }
            out.add(new Target(name, min, max, null, goal, pos(key)));
        }
        return out;
    }
}
