package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.InputException;
import dev.terrace.core.io.InputFiles;
import dev.terrace.core.material.Compound;
import dev.terrace.core.material.Materials;
import dev.terrace.core.material.Metal;
import dev.terrace.core.units.Unit;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Quantity;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.linear.LinearConstraint;
import org.apache.commons.math3.optim.linear.LinearConstraintSet;
import org.apache.commons.math3.optim.linear.LinearObjectiveFunction;
import org.apache.commons.math3.optim.linear.NoFeasibleSolutionException;
import org.apache.commons.math3.optim.linear.Relationship;
import org.apache.commons.math3.optim.linear.SimplexSolver;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/**
 * Reads and validates a campaign YAML file. Every problem is collected and reported with
 * file, line, column and what was expected; nothing stops at the first error.
 *
 * @since 0.1
 */
public final class CampaignReader {

    /** Allowed top-level keys of a campaign file. */
    public static final List<String> TOP_KEYS =
            List.of("campaign", "title", "material", "parameters", "outcomes", "targets", "limits", "models", "runs", "journal",
                    "temperature_calibration", "priors");
    /** Column names the run log reserves for itself. */
    public static final Set<String> RESERVED_COLUMNS = Set.of("run_id", "status", "date", "proposal", "notes");
    /** Default run-log file name when {@code runs:} is absent. */
    public static final String DEFAULT_RUNS = "runs.csv";
    /** Default proposal-journal file name when {@code journal:} is absent. */
    public static final String DEFAULT_JOURNAL = "journal.jsonl";

    private static final List<String> MATERIAL_KEYS = List.of("substrate", "deposit", "group_v");
    private static final List<String> PARAMETER_KEYS = List.of("unit", "min", "max", "scale", "role", "choices");
    private static final List<String> OUTCOME_KEYS = List.of("unit", "scale", "role", "classes");
    private static final List<String> TARGET_KEYS = List.of("min", "max", "is", "maximize", "minimize");
    private static final Pattern ID = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");
    private static final Pattern COLUMN = Pattern.compile("[A-Za-z][A-Za-z0-9_]*");

    private final Path file;
    private final Set<String> knownModels;
    private final List<Diagnostic> problems = new ArrayList<>();

    private CampaignReader(Path file, Set<String> knownModels) {
        this.file = file;
        this.knownModels = knownModels;
    }

    /**
     * Reads a campaign file.
     *
     * @param file        the campaign YAML file
     * @param knownModels ids of the growth-model plugins available, used to check {@code models:};
     *                    null to skip that check
     * @return the campaign and any warnings
     * @throws InputException when the file has errors (every error is listed)
     * @throws IOException    when the file cannot be read for another reason than being absent
     */
    public static Result read(Path file, Set<String> knownModels) throws InputException, IOException {
        String text;
        try {
            byte[] bytes = InputFiles.read(file, InputFiles.CAMPAIGN);
            text = StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (NoSuchFileException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "campaign file not found"));
        } catch (java.nio.charset.CharacterCodingException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "campaign file is not UTF-8 text"));
        }
        return parse(file, new StringReader(text), knownModels);
    }

    /**
     * Parses campaign text.
     *
     * @param file        the name to report in diagnostics and against which {@code runs:} resolves
     * @param in          the text
     * @param knownModels plugin ids for checking {@code models:}, or null to skip
     * @return the campaign and any warnings
     * @throws InputException when the text has errors
     */
    public static Result parse(Path file, Reader in, Set<String> knownModels) throws InputException {
        CampaignReader r = new CampaignReader(file, knownModels);
        Campaign c = r.doParse(in);
        List<Diagnostic> errors = r.problems.stream().filter(Diagnostic::isError).toList();
        if (!errors.isEmpty() || c == null) {
            if (r.problems.isEmpty()) {
                r.problems.add(Diagnostic.error(file, 0, 0, "campaign file could not be read"));
            }
            throw new InputException(sorted(r.problems));
        }
        return new Result(c, sorted(r.problems));
    }

    /**
     * A campaign with the warnings found while reading it.
     *
     * @param campaign the campaign; never null
     * @param warnings the warnings; never null
     */
    public record Result(Campaign campaign, List<Diagnostic> warnings) {
        /** Copies the list. */
        public Result {
            warnings = List.copyOf(warnings);
        }
    }

    private static List<Diagnostic> sorted(List<Diagnostic> ds) {
        List<Diagnostic> out = new ArrayList<>(ds);
        out.sort((a, b) -> a.line() != b.line() ? Integer.compare(a.line(), b.line())
                : Integer.compare(a.column(), b.column()));
        return out;
    }

    // ------------------------------------------------------------------ parsing

    private Campaign doParse(Reader in) {
        LoaderOptions opts = new LoaderOptions();
        opts.setAllowDuplicateKeys(true); // duplicates are reported by us, with both positions
        opts.setMaxAliasesForCollections(10);
        // the same bound as the file size, so text handed to parse() directly is bounded too
        opts.setCodePointLimit((int) InputFiles.MAX_CAMPAIGN_BYTES);
        Node root;
        String text;
        try {
            text = readAll(in);
        } catch (IOException e) {
            error(0, 0, "campaign file could not be read: " + e.getMessage());
            return null;
        }
        try {
            root = new Yaml(opts).compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            String what = e.getProblem() != null ? e.getProblem() : e.getMessage();
            int[] at = m != null ? new int[] {m.getLine() + 1, m.getColumn() + 1} : YamlErrorPosition.of(text, e, opts);
            error(at[0], at[1], "not valid YAML: " + what);
            return null;
        } catch (YAMLException e) {
            // a disallowed character, or a loader limit (nesting depth, aliases): the library gives
            // no line, so find it
            int[] at = YamlErrorPosition.of(text, e, opts);
            String what = e instanceof org.yaml.snakeyaml.reader.ReaderException re
                    ? String.format("character U+%04X is not allowed in YAML text (control characters and"
                    + " non-characters must be removed)", re.getCodePoint())
                    : e.getMessage();
            error(at[0], at[1], "not valid YAML: " + what);
            return null;
        }
        if (root == null) {
            error(0, 0, "the campaign file is empty; expected keys " + String.join(", ", TOP_KEYS));
            return null;
        }
        if (!(root instanceof MappingNode)) {
            error(root, "expected a mapping of campaign keys (" + String.join(", ", TOP_KEYS) + ")");
            return null;
        }
        Map<String, NodeTuple> top = entries((MappingNode) root, TOP_KEYS, "top-level key");

        String id = scalarText(top, "campaign", root, true);
        if (id != null && !ID.matcher(id).matches()) {
            error(top.get("campaign").getValueNode(),
                    "campaign id '" + id + "' must be lower case letters, digits and '-' (for example inas-dots-2027)");
        }
        String title = Optional.ofNullable(scalarText(top, "title", root, false)).orElse("");

        MaterialSpec material = null;
        Surface surface = null;
        NodeTuple mt = top.get("material");
        if (mt == null) {
            error(root, "missing key 'material' (expected {substrate: ..., deposit: ..., group_v: ...})");
        } else {
            Object[] ms = material(mt.getValueNode());
            material = (MaterialSpec) ms[0];
            surface = (Surface) ms[1];
        }

        List<ParameterSpec> parameters = new ArrayList<>();
        NodeTuple pt = top.get("parameters");
        if (pt == null) {
            error(root, "missing key 'parameters' (the recipe settings, one per run-log column)");
        } else {
            parameters = parameters(pt.getValueNode());
        }
        List<OutcomeSpec> outcomes = new ArrayList<>();
        NodeTuple ot = top.get("outcomes");
        if (ot == null) {
            error(root, "missing key 'outcomes' (what is measured after a run)");
        } else {
            outcomes = outcomes(ot.getValueNode());
        }
        Set<String> paramNames = parameters.stream().map(ParameterSpec::name).collect(Collectors.toSet());
        for (OutcomeSpec o : outcomes) {
            if (paramNames.contains(o.name())) {
                error(o.position(), "'" + o.name() + "' is declared both as a parameter and as an outcome");
            }
        }
        List<Target> targets = top.containsKey("targets") ? targets(top.get("targets").getValueNode(), outcomes)
                : List.of();
        Set<String> declared = new LinkedHashSet<>();
        if (pt != null && pt.getValueNode() instanceof MappingNode) {
            for (NodeTuple t : ((MappingNode) pt.getValueNode()).getValue()) {
                if (t.getKeyNode() instanceof ScalarNode) {
                    declared.add(((ScalarNode) t.getKeyNode()).getValue());
                }
            }
        }
        List<LinearLimit> limits = top.containsKey("limits")
                ? limits(top.get("limits").getValueNode(), parameters, declared) : List.of();
        List<String> models = top.containsKey("models") ? models(top.get("models").getValueNode()) : List.of();
        String runs = Optional.ofNullable(scalarText(top, "runs", root, false)).orElse(DEFAULT_RUNS);
        if (runs.isBlank()) {
            error(top.get("runs").getValueNode(), "'runs' must name the run-log CSV file");
        }
        String journal = Optional.ofNullable(scalarText(top, "journal", root, false)).orElse(DEFAULT_JOURNAL);
        if (journal.isBlank()) {
            error(top.get("journal").getValueNode(), "'journal' must name the proposal-journal file"
                    + " (for example " + DEFAULT_JOURNAL + ")");
        } else if (journal.strip().equals(runs.strip())) {
            error(top.get("journal").getValueNode(), "'journal' names the run log " + runs
                    + "; expected a file of its own (for example " + DEFAULT_JOURNAL + ")");
        }
        CalibrationReader cal = new CalibrationReader(file, problems);
        TemperatureCalibration calibration = top.containsKey("temperature_calibration")
                ? cal.calibration(top.get("temperature_calibration").getValueNode()) : TemperatureCalibration.NONE;
        List<PriorSource> priors = top.containsKey("priors") ? cal.priors(top.get("priors").getValueNode()) : List.of();
        if (id == null || material == null || surface == null || calibration == null
                || problems.stream().anyMatch(Diagnostic::isError)) {
            return null;
        }
        Path dir = file.toAbsolutePath().getParent();
        Path runsPath = dir == null ? Path.of(runs) : dir.resolve(runs).normalize();
        Path journalPath = dir == null ? Path.of(journal) : dir.resolve(journal).normalize();
        return new Campaign(id, title, material, surface, parameters, outcomes, targets, limits, models, file,
                runsPath, journalPath, calibration, priors);
    }

    private Object[] material(Node n) {
        if (!(n instanceof MappingNode)) {
            error(n, "expected a mapping {substrate: GaAs, deposit: Ga, group_v: As}");
            return new Object[2];
        }
        Map<String, NodeTuple> m = entries((MappingNode) n, MATERIAL_KEYS, "material key");
        String substrate = scalarText(m, "substrate", n, true);
        String deposit = scalarText(m, "deposit", n, false);
        String groupV = scalarText(m, "group_v", n, false);
        Compound compound = null;
        if (substrate != null) {
            compound = Materials.compound(substrate).orElse(null);
            if (compound == null) {
                error(m.get("substrate").getValueNode(), "unknown substrate '" + substrate + "'; expected one of "
                        + String.join(", ", Materials.compoundNames())
                        + " or a ternary alloy such as In0.3Ga0.7As" + hint(substrate, Materials.compoundNames()));
            }
        }
        Metal metal = null;
        if (deposit != null) {
            metal = Materials.metal(deposit).orElse(null);
            if (metal == null) {
                error(m.get("deposit").getValueNode(), "unknown deposit metal '" + deposit + "'; expected one of "
                        + String.join(", ", Materials.metalNames()) + hint(deposit, Materials.metalNames()));
            }
        }
        if (groupV != null && !Materials.groupVNames().contains(groupV)) {
            error(m.get("group_v").getValueNode(), "unknown group-V element '" + groupV + "'; expected one of "
                    + String.join(", ", Materials.groupVNames()) + hint(groupV, Materials.groupVNames()));
            groupV = null;
        }
        if (substrate == null || compound == null || (deposit != null && metal == null)) {
            return new Object[2];
        }
        MaterialSpec spec = new MaterialSpec(substrate, deposit, groupV);
        String surfaceGroupV = groupV != null ? groupV : compound.groupV();
        Surface s = new Surface(substrate, compound.monolayerHeightNm(), compound.sitesPerCm2(), deposit,
                metal == null ? Double.NaN : metal.meltingK(),
                metal == null ? Double.NaN : metal.liquidAtomsPerNm3(),
                surfaceGroupV,
                metal == null ? Double.NaN : metal.supercoolingLimitK(),
                Materials.crystal(deposit, surfaceGroupV).map(Compound::cationsPerNm3).orElse(Double.NaN));
        return new Object[] {spec, s};
    }

    private List<ParameterSpec> parameters(Node n) {
        List<ParameterSpec> out = new ArrayList<>();
        if (!(n instanceof MappingNode)) {
            error(n, "expected a mapping of setting names to {unit, min, max, ...}");
            return out;
        }
        Map<String, NodeTuple> byName = entries((MappingNode) n, null, "parameter");
        Set<Role> rolesSeen = new LinkedHashSet<>();
        for (Map.Entry<String, NodeTuple> e : byName.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            if (!columnName(name, key)) {
                continue;
            }
            if (!(body instanceof MappingNode)) {
                error(body, "parameter '" + name + "' expects {unit, min, max} or {choices: [...]}");
                continue;
            }
            Map<String, NodeTuple> m = entries((MappingNode) body, PARAMETER_KEYS, "parameter key");
            Role role = role(m, Role.Kind.SETTING);
            if (role != null && !rolesSeen.add(role)) {
                error(m.get("role").getValueNode(), "role '" + role.key() + "' is given to two parameters");
            }
            SourcePosition pos = pos(key);
            if (m.containsKey("choices")) {
                List<String> choices = stringList(m.get("choices").getValueNode(), "choices");
                for (String k : List.of("unit", "min", "max", "scale")) {
                    if (m.containsKey(k)) {
                        error(m.get(k).getKeyNode(), "'" + k + "' does not apply to a setting with choices");
                    }
                }
                if (role != null && role.quantity() != Quantity.CATEGORY) {
                    error(m.get("role").getValueNode(), "role '" + role.key() + "' is numeric ("
                            + role.quantity().canonicalUnit() + "), but '" + name + "' has choices");
                    role = null;
                }
                if (choices.isEmpty()) {
                    error(m.get("choices").getValueNode(), "choices must list at least one value");
                    continue;
                }
                out.add(new ParameterSpec(name, null, Double.NaN, Double.NaN, Scale.LINEAR, role, choices, pos));
                continue;
            }
            if (role != null && role.quantity() == Quantity.CATEGORY) {
                error(m.get("role").getValueNode(), "role '" + role.key() + "' needs choices: [...]");
                role = null;
            }
            Unit unit = unit(m, body, name, role == null ? null : role.quantity(), false);
            Double min = number(m, "min", body, name);
            Double max = number(m, "max", body, name);
            Scale scale = scale(m);
            boolean ok = unit != null && min != null && max != null;
            if (min != null && max != null && !(min < max)) {
                error(m.get("min").getValueNode(), "min (" + fmt(min) + ") must be below max (" + fmt(max) + ")");
                ok = false;
            }
            if (scale == Scale.LOG && min != null && !(min > 0)) {
                error(m.get("min").getValueNode(), "scale: log needs min > 0, found " + fmt(min));
                ok = false;
            }
            if (ok && unit != null && isPhysicallyImpossible(unit, min, 1.0)) {
                error(m.get("min").getValueNode(), "min " + fmt(min) + " " + unit.symbol() + " is not physical"
                        + (unit.quantity() == Quantity.TEMPERATURE ? " (below 0 K)" : " (negative)"));
            }
            if (ok) {
                out.add(new ParameterSpec(name, unit, min, max, scale == null ? Scale.LINEAR : scale, role,
                        List.of(), pos));
            }
        }
        return out;
    }

    /** Negative amounts and temperatures below 0 K; the sign does not depend on the monolayer height. */
    private static boolean isPhysicallyImpossible(Unit unit, double value, double monolayerHeightNm) {
        Quantity q = unit.quantity();
        if (q == Quantity.ANGLE || q == Quantity.DIMENSIONLESS) {
            return false;
        }
        return unit.toCanonical(value, monolayerHeightNm) < 0;
    }

    private List<OutcomeSpec> outcomes(Node n) {
        List<OutcomeSpec> out = new ArrayList<>();
        if (!(n instanceof MappingNode)) {
            error(n, "expected a mapping of outcome names to {unit, ...} or {classes: [...]}");
            return out;
        }
        Map<String, NodeTuple> byName = entries((MappingNode) n, null, "outcome");
        for (Map.Entry<String, NodeTuple> e : byName.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            if (!columnName(name, key)) {
                continue;
            }
            if (!(body instanceof MappingNode)) {
                error(body, "outcome '" + name + "' expects {unit: ...} or {classes: [...]}");
                continue;
            }
            Map<String, NodeTuple> m = entries((MappingNode) body, OUTCOME_KEYS, "outcome key");
            Role role = role(m, Role.Kind.OUTCOME);
            if (m.containsKey("classes")) {
                List<String> classes = stringList(m.get("classes").getValueNode(), "classes");
                for (String k : List.of("unit", "scale")) {
                    if (m.containsKey(k)) {
                        error(m.get(k).getKeyNode(), "'" + k + "' does not apply to a class outcome");
                    }
                }
                if (role != null && role.quantity() != Quantity.CLASS) {
                    error(m.get("role").getValueNode(), "role '" + role.key() + "' is numeric, but '" + name
                            + "' has classes");
                    role = null;
                }
                if (classes.size() < 2) {
                    error(m.get("classes").getValueNode(), "a class outcome needs at least two classes");
                    continue;
                }
                out.add(new OutcomeSpec(name, null, Scale.LINEAR, role, classes, pos(key)));
                continue;
            }
            if (role != null && role.quantity() == Quantity.CLASS) {
                error(m.get("role").getValueNode(), "role '" + role.key() + "' needs classes: [...]");
                role = null;
            }
            Unit unit = unit(m, body, name, role == null ? null : role.quantity(), true);
            Scale scale = scale(m);
            if (unit != null) {
                out.add(new OutcomeSpec(name, unit, scale == null ? Scale.LINEAR : scale, role, List.of(), pos(key)));
            }
        }
        return out;
    }

    private List<Target> targets(Node n, List<OutcomeSpec> outcomes) {
        List<Target> out = new ArrayList<>();
        if (!(n instanceof MappingNode)) {
            error(n, "expected a mapping of outcome names to {min, max} or {is: class}");
            return out;
        }
        Map<String, OutcomeSpec> byName = new LinkedHashMap<>();
        outcomes.forEach(o -> byName.put(o.name(), o));
        Map<String, NodeTuple> entries = entries((MappingNode) n, null, "target");
        String objectiveSeen = null;
        for (Map.Entry<String, NodeTuple> e : entries.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            OutcomeSpec o = byName.get(name);
            if (o == null) {
                error(key, "target on '" + name + "', which is not a declared outcome" + hint(name, byName.keySet()));
                continue;
            }
            if (!(body instanceof MappingNode)) {
                error(body, "target '" + name + "' expects {min: ..., max: ...} or {is: ...}");
                continue;
            }
            Map<String, NodeTuple> m = entries((MappingNode) body, TARGET_KEYS, "target key");
            if (o.isClass()) {
                for (String k : List.of("min", "max")) {
                    if (m.containsKey(k)) {
                        error(m.get(k).getKeyNode(), "'" + name + "' is a class outcome: use is: <class>, not " + k);
                    }
                }
                String is = scalarText(m, "is", body, true);
                if (is != null && !o.classes().contains(is)) {
                    error(m.get("is").getValueNode(), "'" + is + "' is not a class of '" + name + "'; expected one of "
                            + String.join(", ", o.classes()) + hint(is, o.classes()));
                } else if (is != null) {
                    out.add(new Target(name, Double.NaN, Double.NaN, is, pos(key)));
                }
                continue;
            }
            if (m.containsKey("is")) {
                error(m.get("is").getKeyNode(), "'" + name + "' is numeric: use min and/or max, not is");
                continue;
            }
            Target.Goal goal = Target.Goal.WINDOW;
            boolean goalOk = true;
            for (String k : List.of("maximize", "minimize")) {
                if (!m.containsKey(k)) {
                    continue;
                }
                String v = scalar(m.get(k).getValueNode(), k);
                if ("true".equals(v)) {
                    if (goal != Target.Goal.WINDOW) {
                        error(m.get(k).getKeyNode(), "target '" + name + "' cannot both maximize and minimize");
                        goalOk = false;
                    }
                    goal = k.equals("maximize") ? Target.Goal.MAXIMIZE : Target.Goal.MINIMIZE;
                } else if (!"false".equals(v)) {
                    error(m.get(k).getValueNode(), k + " expects true or false, found '" + v + "'");
                    goalOk = false;
                }
            }
            if (!goalOk) {
                continue;
            }
            Double min = m.containsKey("min") ? number(m, "min", body, name) : Double.valueOf(Double.NaN);
            Double max = m.containsKey("max") ? number(m, "max", body, name) : Double.valueOf(Double.NaN);
            if (min == null || max == null) {
                continue;
            }
            if (min.isNaN() && max.isNaN() && goal == Target.Goal.WINDOW) {
                error(body, "target '" + name + "' needs min, max or both (or maximize: true / minimize: true)");
                continue;
            }
            if (goal != Target.Goal.WINDOW && objectiveSeen != null) {
                error(key, "only one target may maximize or minimize; '" + objectiveSeen + "' already does");
                continue;
            }
            if (goal != Target.Goal.WINDOW) {
                objectiveSeen = name;
            }
            if (!min.isNaN() && !max.isNaN() && !(min < max)) {
                error(m.get("min").getValueNode(), "target min (" + fmt(min) + ") must be below max (" + fmt(max) + ")");
                continue;
            }
            if (o.scale() == Scale.LOG && ((!min.isNaN() && min <= 0) || (!max.isNaN() && max <= 0))) {
                error(body, "'" + name + "' has scale: log, so its target bounds must be positive");
                continue;
            }
            out.add(new Target(name, min, max, null, goal, pos(key)));
        }
        return out;
    }

    /**
     * Reads the limits. {@code declared} holds every parameter name written in the campaign, also
     * those whose declaration had an error: a limit naming one of those is left out quietly, as the
     * declaration's own error already says what to fix (one cause, one message).
     */
    private List<LinearLimit> limits(Node n, List<ParameterSpec> parameters, Set<String> declared) {
        List<LinearLimit> out = new ArrayList<>();
        if (!(n instanceof SequenceNode)) {
            error(n, "expected a list of limits such as '- anneal_temp >= substrate_temp'");
            return out;
        }
        Map<String, ParameterSpec> byName = new LinkedHashMap<>();
        parameters.forEach(p -> byName.put(p.name(), p));
        for (Node item : ((SequenceNode) n).getValue()) {
            if (!(item instanceof ScalarNode)) {
                error(item, "a limit is one line of text such as 'anneal_temp >= substrate_temp + 20'");
                continue;
            }
            String text = ((ScalarNode) item).getValue();
            LinearLimit limit;
            try {
                limit = LimitParser.parse(text, pos(item));
            } catch (LimitParser.LimitSyntaxException e) {
                error(item.getStartMark().getLine() + 1, item.getStartMark().getColumn() + 1 + e.offset,
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
                    error(item.getStartMark().getLine() + 1, item.getStartMark().getColumn() + 1 + Math.max(at, 0),
                            "limit names unknown parameter '" + name + "'" + hint(name, byName.keySet()));
                    ok = false;
                } else if (p.isCategorical()) {
                    error(item, "limit names '" + name + "', which has choices; limits apply to numeric settings");
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
                error(l.position(), "no setting inside the parameter boxes satisfies the limit '" + l.text()
                        + "'; widen the boxes or correct the limit");
                anyAlone = true;
            }
        }
        if (!anyAlone && limits.size() > 1 && !feasible(limits, byName)) {
            error(limits.get(0).position(), "the limits cannot all hold at once inside the parameter boxes: "
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

    private List<String> models(Node n) {
        List<String> out = stringList(n, "models");
        if (!(n instanceof SequenceNode)) {
            return out;
        }
        List<Node> items = ((SequenceNode) n).getValue();
        Set<String> seen = new LinkedHashSet<>();
        for (int i = 0; i < out.size() && i < items.size(); i++) {
            String id = out.get(i);
            if (!seen.add(id)) {
                error(items.get(i), "growth model '" + id + "' is listed twice");
            }
            if (knownModels != null && !knownModels.contains(id)) {
                error(items.get(i), "unknown growth model '" + id + "'; available: "
                        + (knownModels.isEmpty() ? "(none found)" : String.join(", ", knownModels))
                        + hint(id, knownModels));
            }
        }
        return List.copyOf(seen);
    }

    // ------------------------------------------------------------------ helpers

    private Role role(Map<String, NodeTuple> m, Role.Kind kind) {
        NodeTuple t = m.get("role");
        if (t == null) {
            return null;
        }
        String key = scalar(t.getValueNode(), "role");
        if (key == null) {
            return null;
        }
        List<String> allowed = Arrays.stream(Role.values()).filter(r -> r.kind() == kind).map(Role::key).toList();
        Optional<Role> r = Role.byKey(key);
        if (r.isEmpty() || r.get().kind() != kind) {
            String what = kind == Role.Kind.SETTING ? "setting" : "outcome";
            error(t.getValueNode(), "unknown " + what + " role '" + key + "'; expected one of "
                    + String.join(", ", allowed) + hint(key, allowed));
            return null;
        }
        return r.get();
    }

    /**
     * The unit of a setting or outcome. A bad unit is reported once and a label unit returned, so
     * the setting or outcome still exists for the targets, limits and run-log columns that name it
     * (no cascade of errors after one bad unit). An outcome with no role may carry any label.
     */
    private Unit unit(Map<String, NodeTuple> m, Node body, String name, Quantity expected, boolean anyLabel) {
        NodeTuple t = m.get("unit");
        if (t == null) {
            error(body, "'" + name + "' needs a unit (for example "
                    + (expected == null ? "degC, ML, ML/s, Torr" : String.join(", ", Units.symbolsOf(expected))) + ")");
            return null;
        }
        String sym = scalar(t.getValueNode(), "unit");
        if (sym == null) {
            return null;
        }
        if (expected != null) {
            Optional<Unit> u = Units.forQuantity(sym, expected);
            if (u.isEmpty()) {
                List<String> ok = Units.symbolsOf(expected);
                error(t.getValueNode(), "unit '" + sym + "' does not fit role quantity "
                        + expected.name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ') + "; expected one of "
                        + String.join(", ", ok) + hint(sym, ok));
            }
            return u.orElseGet(() -> sym.isBlank() ? null : Units.label(sym));
        }
        Optional<Unit> u = Units.bySymbol(sym);
        if (u.isEmpty() && !anyLabel) {
            error(t.getValueNode(), "unknown unit '" + sym + "'; expected one of " + String.join(", ", Units.symbols())
                    + hint(sym, Units.symbols()));
        }
        return u.orElseGet(() -> sym.isBlank() ? null : Units.label(sym));
    }

    private Scale scale(Map<String, NodeTuple> m) {
        NodeTuple t = m.get("scale");
        if (t == null) {
            return null;
        }
        String s = scalar(t.getValueNode(), "scale");
        if ("log".equals(s)) {
            return Scale.LOG;
        }
        if ("linear".equals(s)) {
            return Scale.LINEAR;
        }
        if (s != null) {
            error(t.getValueNode(), "scale must be 'linear' or 'log', found '" + s + "'");
        }
        return null;
    }

    private Double number(Map<String, NodeTuple> m, String key, Node parent, String owner) {
        NodeTuple t = m.get(key);
        if (t == null) {
            error(parent, "'" + owner + "' needs " + key);
            return null;
        }
        String s = scalar(t.getValueNode(), key);
        if (s == null) {
            return null;
        }
        try {
            double v = Double.parseDouble(s.trim());
            if (!Double.isFinite(v)) {
                error(t.getValueNode(), key + " must be a finite number, found '" + s + "'");
                return null;
            }
            return v;
        } catch (NumberFormatException e) {
            error(t.getValueNode(), key + " must be a number, found '" + s + "'"
                    + (s.contains(",") ? " (use a decimal point)" : ""));
            return null;
        }
    }

    private boolean columnName(String name, Node key) {
        if (!COLUMN.matcher(name).matches()) {
            error(key, "'" + name + "' is not a usable column name: start with a letter, then letters, digits or '_'");
            return false;
        }
        if (RESERVED_COLUMNS.contains(name)) {
            error(key, "'" + name + "' is a reserved run-log column (" + String.join(", ", RESERVED_COLUMNS) + ")");
            return false;
        }
        return true;
    }

    private List<String> stringList(Node n, String what) {
        List<String> out = new ArrayList<>();
        if (!(n instanceof SequenceNode)) {
            error(n, what + " must be a list such as [a, b]");
            return out;
        }
        Set<String> seen = new LinkedHashSet<>();
        for (Node item : ((SequenceNode) n).getValue()) {
            String s = scalar(item, what);
            if (s == null) {
                continue;
            }
            if (s.isBlank()) {
                error(item, what + " holds an empty entry");
                continue;
            }
            if (!what.equals("models") && !seen.add(s)) {
                error(item, "'" + s + "' appears twice in " + what);
                continue;
            }
            out.add(s);
        }
        return out;
    }

    private String scalarText(Map<String, NodeTuple> m, String key, Node parent, boolean required) {
        NodeTuple t = m.get(key);
        if (t == null) {
            if (required) {
                error(parent, "missing key '" + key + "'");
            }
            return null;
        }
        return scalar(t.getValueNode(), key);
    }

    private String scalar(Node n, String what) {
        if (!(n instanceof ScalarNode)) {
            error(n, what + " must be a single value, not a " + (n instanceof SequenceNode ? "list" : "mapping"));
            return null;
        }
        return ((ScalarNode) n).getValue();
    }

    /** Entries of a mapping by key text; reports non-scalar keys, duplicates and (if allowed != null) unknown keys. */
    private Map<String, NodeTuple> entries(MappingNode m, Collection<String> allowed, String what) {
        Map<String, NodeTuple> out = new LinkedHashMap<>();
        for (NodeTuple t : m.getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode)) {
                error(t.getKeyNode(), what + " must be a plain name");
                continue;
            }
            String k = ((ScalarNode) t.getKeyNode()).getValue();
            if (out.containsKey(k)) {
                error(t.getKeyNode(), "duplicate " + what + " '" + k + "' (first at line "
                        + (out.get(k).getKeyNode().getStartMark().getLine() + 1) + ")");
                continue;
            }
            if (allowed != null && !allowed.contains(k)) {
                error(t.getKeyNode(), "unknown " + what + " '" + k + "'; expected one of " + String.join(", ", allowed)
                        + hint(k, allowed));
                continue;
            }
            out.put(k, t);
        }
        return out;
    }

    private static String hint(String given, Collection<String> known) {
        return DidYouMean.suggest(given, known).map(s -> " (did you mean '" + s + "'?)").orElse("");
    }

    private static String fmt(double v) {
        return (v == Math.rint(v) && Math.abs(v) < 1e15) ? String.valueOf((long) v) : String.valueOf(v);
    }

    private static SourcePosition pos(Node n) {
        return new SourcePosition(n.getStartMark().getLine() + 1, n.getStartMark().getColumn() + 1);
    }

    private void error(Node n, String message) {
        error(n.getStartMark().getLine() + 1, n.getStartMark().getColumn() + 1, message);
    }

    private void error(SourcePosition p, String message) {
        error(p.line(), p.column(), message);
    }

    private static String readAll(Reader in) throws IOException {
        StringBuilder sb = new StringBuilder();
        char[] buf = new char[8192];
        for (int n; (n = in.read(buf)) >= 0; ) {
            sb.append(buf, 0, n);
        }
        return sb.toString();
    }

    private void error(int line, int column, String message) {
        problems.add(Diagnostic.error(file, line, column, message));
    }
}
