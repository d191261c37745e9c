package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
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
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

import static dev.terrace.core.campaign.YamlNodes.fmt;
import static dev.terrace.core.campaign.YamlNodes.hint;
import static dev.terrace.core.campaign.YamlNodes.pos;

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
    private static final Pattern ID = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");
    private static final Pattern COLUMN = Pattern.compile("[A-Za-z][A-Za-z0-9_]*");

    private final Path file;
    private final Set<String> knownModels;
    private final List<Diagnostic> problems = new ArrayList<>();
    private final YamlNodes yaml;

    private CampaignReader(Path file, Set<String> knownModels) {
        this.file = file;
        this.knownModels = knownModels;
        this.yaml = new YamlNodes(file, problems);
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
        String text;
        try {
            text = readAll(in);
        } catch (IOException e) {
            yaml.error(0, 0, "campaign file could not be read: " + e.getMessage());
            return null;
        }
        int reported = problems.size();
        Node root = yaml.compose(text);
        if (root == null) {
            if (problems.size() == reported) { // valid YAML, but nothing in it
                yaml.error(0, 0, "the campaign file is empty; expected keys " + String.join(", ", TOP_KEYS));
            }
            return null;
        }
        if (!(root instanceof MappingNode)) {
            yaml.error(root, "expected a mapping of campaign keys (" + String.join(", ", TOP_KEYS) + ")");
            return null;
        }
        Map<String, NodeTuple> top = yaml.entries((MappingNode) root, TOP_KEYS, "top-level key");

        String id = yaml.scalarText(top, "campaign", root, true);
        if (id != null && !ID.matcher(id).matches()) {
            yaml.error(top.get("campaign").getValueNode(),
                    "campaign id '" + id + "' must be lower case letters, digits and '-' (for example inas-dots-2027)");
        }
        String title = Optional.ofNullable(yaml.scalarText(top, "title", root, false)).orElse("");

        MaterialSpec material = null;
        Surface surface = null;
        NodeTuple mt = top.get("material");
        if (mt == null) {
            yaml.error(root, "missing key 'material' (expected {substrate: ..., deposit: ..., group_v: ...})");
        } else {
            Object[] ms = material(mt.getValueNode());
            material = (MaterialSpec) ms[0];
            surface = (Surface) ms[1];
        }

        List<ParameterSpec> parameters = new ArrayList<>();
        NodeTuple pt = top.get("parameters");
        if (pt == null) {
            yaml.error(root, "missing key 'parameters' (the recipe settings, one per run-log column)");
        } else {
            parameters = parameters(pt.getValueNode());
        }
        List<OutcomeSpec> outcomes = new ArrayList<>();
        NodeTuple ot = top.get("outcomes");
        if (ot == null) {
            yaml.error(root, "missing key 'outcomes' (what is measured after a run)");
        } else {
            outcomes = outcomes(ot.getValueNode());
        }
        Set<String> paramNames = parameters.stream().map(ParameterSpec::name).collect(Collectors.toSet());
        for (OutcomeSpec o : outcomes) {
            if (paramNames.contains(o.name())) {
                yaml.error(o.position(), "'" + o.name() + "' is declared both as a parameter and as an outcome");
            }
        }
        List<Target> targets = top.containsKey("targets")
                ? new CampaignTargets(yaml).read(top.get("targets").getValueNode(), outcomes) : List.of();
        Set<String> declared = new LinkedHashSet<>();
        if (pt != null && pt.getValueNode() instanceof MappingNode) {
            for (NodeTuple t : ((MappingNode) pt.getValueNode()).getValue()) {
                if (t.getKeyNode() instanceof ScalarNode) {
                    declared.add(((ScalarNode) t.getKeyNode()).getValue());
                }
            }
        }
        List<LinearLimit> limits = top.containsKey("limits")
                ? new CampaignLimits(yaml).read(top.get("limits").getValueNode(), parameters, declared) : List.of();
        List<String> models = top.containsKey("models") ? models(top.get("models").getValueNode()) : List.of();
        String runs = Optional.ofNullable(yaml.scalarText(top, "runs", root, false)).orElse(DEFAULT_RUNS);
        if (runs.isBlank()) {
            yaml.error(top.get("runs").getValueNode(), "'runs' must name the run-log CSV file");
        }
        String journal = Optional.ofNullable(yaml.scalarText(top, "journal", root, false)).orElse(DEFAULT_JOURNAL);
        if (journal.isBlank()) {
            yaml.error(top.get("journal").getValueNode(), "'journal' must name the proposal-journal file"
                    + " (for example " + DEFAULT_JOURNAL + ")");
        } else if (journal.strip().equals(runs.strip())) {
            yaml.error(top.get("journal").getValueNode(), "'journal' names the run log " + runs
                    + "; expected a file of its own (for example " + DEFAULT_JOURNAL + ")");
        }
        CalibrationReader cal = new CalibrationReader(yaml);
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
            yaml.error(n, "expected a mapping {substrate: GaAs, deposit: Ga, group_v: As}");
            return new Object[2];
        }
        Map<String, NodeTuple> m = yaml.entries((MappingNode) n, MATERIAL_KEYS, "material key");
        String substrate = yaml.scalarText(m, "substrate", n, true);
        String deposit = yaml.scalarText(m, "deposit", n, false);
        String groupV = yaml.scalarText(m, "group_v", n, false);
        Compound compound = null;
        if (substrate != null) {
            compound = Materials.compound(substrate).orElse(null);
            if (compound == null) {
                yaml.error(m.get("substrate").getValueNode(), "unknown substrate '" + substrate + "'; expected one of "
                        + String.join(", ", Materials.compoundNames())
                        + " or a ternary alloy such as In0.3Ga0.7As" + hint(substrate, Materials.compoundNames()));
            }
        }
        Metal metal = null;
        if (deposit != null) {
            metal = Materials.metal(deposit).orElse(null);
            if (metal == null) {
                yaml.error(m.get("deposit").getValueNode(), "unknown deposit metal '" + deposit + "'; expected one of "
                        + String.join(", ", Materials.metalNames()) + hint(deposit, Materials.metalNames()));
            }
        }
        if (groupV != null && !Materials.groupVNames().contains(groupV)) {
            yaml.error(m.get("group_v").getValueNode(), "unknown group-V element '" + groupV + "'; expected one of "
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
            yaml.error(n, "expected a mapping of setting names to {unit, min, max, ...}");
            return out;
        }
        Map<String, NodeTuple> byName = yaml.entries((MappingNode) n, null, "parameter");
        Set<Role> rolesSeen = new LinkedHashSet<>();
        for (Map.Entry<String, NodeTuple> e : byName.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            if (!columnName(name, key)) {
                continue;
            }
            if (!(body instanceof MappingNode)) {
                yaml.error(body, "parameter '" + name + "' expects {unit, min, max} or {choices: [...]}");
                continue;
            }
            Map<String, NodeTuple> m = yaml.entries((MappingNode) body, PARAMETER_KEYS, "parameter key");
            Role role = role(m, Role.Kind.SETTING);
            if (role != null && !rolesSeen.add(role)) {
                yaml.error(m.get("role").getValueNode(), "role '" + role.key() + "' is given to two parameters");
            }
            SourcePosition pos = pos(key);
            if (m.containsKey("choices")) {
                List<String> choices = yaml.stringList(m.get("choices").getValueNode(), "choices");
                for (String k : List.of("unit", "min", "max", "scale")) {
                    if (m.containsKey(k)) {
                        yaml.error(m.get(k).getKeyNode(), "'" + k + "' does not apply to a setting with choices");
                    }
                }
                if (role != null && role.quantity() != Quantity.CATEGORY) {
                    yaml.error(m.get("role").getValueNode(), "role '" + role.key() + "' is numeric ("
                            + role.quantity().canonicalUnit() + "), but '" + name + "' has choices");
                    role = null;
                }
                if (choices.isEmpty()) {
                    yaml.error(m.get("choices").getValueNode(), "choices must list at least one value");
                    continue;
                }
                out.add(new ParameterSpec(name, null, Double.NaN, Double.NaN, Scale.LINEAR, role, choices, pos));
                continue;
            }
            if (role != null && role.quantity() == Quantity.CATEGORY) {
                yaml.error(m.get("role").getValueNode(), "role '" + role.key() + "' needs choices: [...]");
                role = null;
            }
            Unit unit = unit(m, body, name, role == null ? null : role.quantity(), false);
            Double min = yaml.number(m, "min", body, name);
            Double max = yaml.number(m, "max", body, name);
            Scale scale = scale(m);
            boolean ok = unit != null && min != null && max != null;
            if (min != null && max != null && !(min < max)) {
                yaml.error(m.get("min").getValueNode(), "min (" + fmt(min) + ") must be below max (" + fmt(max) + ")");
                ok = false;
            }
            if (scale == Scale.LOG && min != null && !(min > 0)) {
                yaml.error(m.get("min").getValueNode(), "scale: log needs min > 0, found " + fmt(min));
                ok = false;
            }
            if (ok && unit != null && isPhysicallyImpossible(unit, min, 1.0)) {
                yaml.error(m.get("min").getValueNode(), "min " + fmt(min) + " " + unit.symbol() + " is not physical"
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
            yaml.error(n, "expected a mapping of outcome names to {unit, ...} or {classes: [...]}");
            return out;
        }
        Map<String, NodeTuple> byName = yaml.entries((MappingNode) n, null, "outcome");
        for (Map.Entry<String, NodeTuple> e : byName.entrySet()) {
            String name = e.getKey();
            Node key = e.getValue().getKeyNode();
            Node body = e.getValue().getValueNode();
            if (!columnName(name, key)) {
                continue;
            }
            if (!(body instanceof MappingNode)) {
                yaml.error(body, "outcome '" + name + "' expects {unit: ...} or {classes: [...]}");
                continue;
            }
            Map<String, NodeTuple> m = yaml.entries((MappingNode) body, OUTCOME_KEYS, "outcome key");
            Role role = role(m, Role.Kind.OUTCOME);
            if (m.containsKey("classes")) {
                List<String> classes = yaml.stringList(m.get("classes").getValueNode(), "classes");
                for (String k : List.of("unit", "scale")) {
                    if (m.containsKey(k)) {
                        yaml.error(m.get(k).getKeyNode(), "'" + k + "' does not apply to a class outcome");
                    }
                }
                if (role != null && role.quantity() != Quantity.CLASS) {
                    yaml.error(m.get("role").getValueNode(), "role '" + role.key() + "' is numeric, but '" + name
                            + "' has classes");
                    role = null;
                }
                if (classes.size() < 2) {
                    yaml.error(m.get("classes").getValueNode(), "a class outcome needs at least two classes");
                    continue;
                }
                out.add(new OutcomeSpec(name, null, Scale.LINEAR, role, classes, pos(key)));
                continue;
            }
            if (role != null && role.quantity() == Quantity.CLASS) {
                yaml.error(m.get("role").getValueNode(), "role '" + role.key() + "' needs classes: [...]");
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

    private List<String> models(Node n) {
        List<String> out = yaml.stringList(n, "models");
        if (!(n instanceof SequenceNode)) {
            return out;
        }
        List<Node> items = ((SequenceNode) n).getValue();
        Set<String> seen = new LinkedHashSet<>();
        for (int i = 0; i < out.size() && i < items.size(); i++) {
            String id = out.get(i);
            if (!seen.add(id)) {
                yaml.error(items.get(i), "growth model '" + id + "' is listed twice");
            }
            if (knownModels != null && !knownModels.contains(id)) {
                yaml.error(items.get(i), "unknown growth model '" + id + "'; available: "
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
        String key = yaml.scalar(t.getValueNode(), "role");
        if (key == null) {
            return null;
        }
        List<String> allowed = Arrays.stream(Role.values()).filter(r -> r.kind() == kind).map(Role::key).toList();
        Optional<Role> r = Role.byKey(key);
        if (r.isEmpty() || r.get().kind() != kind) {
            String what = kind == Role.Kind.SETTING ? "setting" : "outcome";
            yaml.error(t.getValueNode(), "unknown " + what + " role '" + key + "'; expected one of "
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
            yaml.error(body, "'" + name + "' needs a unit (for example "
                    + (expected == null ? "degC, ML, ML/s, Torr" : String.join(", ", Units.symbolsOf(expected))) + ")");
            return null;
        }
        String sym = yaml.scalar(t.getValueNode(), "unit");
        if (sym == null) {
            return null;
        }
        if (expected != null) {
            Optional<Unit> u = Units.forQuantity(sym, expected);
            if (u.isEmpty()) {
                List<String> ok = Units.symbolsOf(expected);
                yaml.error(t.getValueNode(), "unit '" + sym + "' does not fit role quantity "
                        + expected.name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ') + "; expected one of "
                        + String.join(", ", ok) + hint(sym, ok));
            }
            return u.orElseGet(() -> sym.isBlank() ? null : Units.label(sym));
        }
        Optional<Unit> u = Units.bySymbol(sym);
        if (u.isEmpty() && !anyLabel) {
            yaml.error(t.getValueNode(), "unknown unit '" + sym + "'; expected one of " + String.join(", ", Units.symbols())
                    + hint(sym, Units.symbols()));
        }
        return u.orElseGet(() -> sym.isBlank() ? null : Units.label(sym));
    }

    private Scale scale(Map<String, NodeTuple> m) {
        NodeTuple t = m.get("scale");
        if (t == null) {
            return null;
        }
        String s = yaml.scalar(t.getValueNode(), "scale");
        if ("log".equals(s)) {
            return Scale.LOG;
        }
        if ("linear".equals(s)) {
            return Scale.LINEAR;
        }
        if (s != null) {
            yaml.error(t.getValueNode(), "scale must be 'linear' or 'log', found '" + s + "'");
        }
        return null;
    }

    private boolean columnName(String name, Node key) {
        if (!COLUMN.matcher(name).matches()) {
            yaml.error(key, "'" + name + "' is not a usable column name: start with a letter, then letters, digits or '_'");
            return false;
        }
        if (RESERVED_COLUMNS.contains(name)) {
            yaml.error(key, "'" + name + "' is a reserved run-log column (" + String.join(", ", RESERVED_COLUMNS) + ")");
            return false;
        }
        return true;
    }

    private static String readAll(Reader in) throws IOException {
        StringBuilder sb = new StringBuilder();
        char[] buf = new char[8192];
        for (int n; (n = in.read(buf)) >= 0; ) {
            sb.append(buf, 0, n);
        }
        return sb.toString();
    }

}
