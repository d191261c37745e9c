package dev.terrace.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.plugins.LoadedModel;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.Role;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

/** {@code terrace models}: lists the growth-model plugins found. */
@Command(name = "models", mixinStandardHelpOptions = true,
        description = {"List the growth-model plugins found (what they need, what they predict, their parameters)"
                + " and the materials a campaign's material section may name.",
                "The json format lists the plugins only."})
final class ModelsCommand implements Callable<Integer> {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Option(names = "--format", defaultValue = "table", description = "table or json (default: ${DEFAULT-VALUE}).")
    String format;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PluginRegistry r = Registries.load(global, spec.commandLine().getErr());
        if ("json".equals(format)) {
            ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            ArrayNode arr = om.createArrayNode();
            for (LoadedModel lm : r.models()) {
                GrowthModel m = lm.model();
                ObjectNode o = arr.addObject();
                o.put("id", lm.id());
                o.put("description", m.description());
                o.put("class", lm.className());
                o.put("source", lm.source());
                ArrayNode needs = o.putArray("needs");
                m.requiredInputs().forEach(x -> needs.add(x.key()));
                ArrayNode opt = o.putArray("uses_if_present");
                m.optionalInputs().forEach(x -> opt.add(x.key()));
                ArrayNode pred = o.putArray("predicts");
                m.predictedOutcomes().forEach(x -> pred.add(x.key()));
                ArrayNode ps = o.putArray("parameters");
                for (ModelParameter p : m.parameters()) {
                    ObjectNode po = ps.addObject();
                    po.put("name", p.name());
                    po.put("unit", p.unit());
                    po.put("default", p.defaultValue());
                    po.put("min", p.min());
                    po.put("max", p.max());
                    if (p.isDiscrete()) {
                        ArrayNode ch = po.putArray("choices");
                        p.choices().forEach(ch::add);
                    }
                    po.put("source", p.source());
                }
            }
            out.println(om.writeValueAsString(arr));
        } else if ("table".equals(format)) {
            if (r.models().isEmpty()) {
                out.println("No growth-model plugins found.");
            }
            for (LoadedModel lm : r.models()) {
                GrowthModel m = lm.model();
                out.println(lm.id() + "  -  " + m.description());
                out.println("  from      " + lm.className() + " (" + lm.source() + ")");
                out.println("  needs     " + keys(m.requiredInputs()));
                if (!m.optionalInputs().isEmpty()) {
                    out.println("  uses      " + keys(m.optionalInputs()) + " (when the campaign has them)");
                }
                out.println("  predicts  " + keys(m.predictedOutcomes()));
                out.println("  parameters:");
                for (ModelParameter p : m.parameters()) {
                    String dflt = Format.num(p.defaultValue()) + (p.unit().isEmpty() ? "" : " " + p.unit());
                    String range = p.isDiscrete()
                            ? "one of " + p.choices().stream().map(Format::num).collect(Collectors.joining(", "))
                            : Format.num(p.min()) + " to " + Format.num(p.max());
                    out.println("    " + Format.pad(p.name(), 26) + Format.pad(dflt, 14) + "(" + range + ")");
                    out.println("    " + " ".repeat(26) + "source: " + p.source());
                }
                out.println();
            }
            printMaterials(out);
        } else {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--format must be table or json, found '" + format + "'");
        }
        out.flush();
        return r.hasFatalProblems() ? Main.EXIT_FAILED : 0;
    }

    /** The material table: the keys a campaign's {@code material:} section may use. */
    static void printMaterials(PrintWriter out) {
        out.println("Materials (keys for the campaign's material section):");
        out.println("  substrate  " + String.join(", ", new java.util.TreeSet<>(
                dev.terrace.core.material.Materials.compoundNames())) + ", or a ternary alloy such as In0.3Ga0.7As"
                + " (lattice constant by Vegard's law)");
        out.println("  deposit    " + String.join(", ", new java.util.TreeSet<>(
                dev.terrace.core.material.Materials.metalNames())) + " (the droplet metal; leave it out for film growth)");
        out.println("  group_v    " + String.join(", ", new java.util.TreeSet<>(
                dev.terrace.core.material.Materials.groupVNames())));
        out.println("  source     " + dev.terrace.core.material.Materials.VURGAFTMAN_2001 + " (compound lattice constants)");
    }

    private static String keys(Set<Role> roles) {
        return roles.isEmpty() ? "(nothing)" : roles.stream().map(Role::key).sorted().collect(Collectors.joining(", "));
    }
}
