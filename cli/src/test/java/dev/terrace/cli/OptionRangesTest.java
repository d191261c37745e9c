package dev.terrace.cli;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static dev.terrace.cli.CliSafetyTest.assertRefused;
import static dev.terrace.cli.CliSafetyTest.hashes;
import static dev.terrace.cli.CliSafetyTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every numeric option has a checked range (found by walking Main's commands), and one table of
 * refusals: each value outside its range, or text that is not a number of its kind, exits with 2
 * and a message naming the option, the range and the value; an empty path does the same. Nothing
 * runs before the check, so the demo campaign's files (invented data) keep their bytes.
 */
class OptionRangesTest {

    private static final Set<Class<?>> NUMERIC = Set.of(int.class, long.class, double.class, float.class,
            Integer.class, Long.class, Double.class, Float.class);

    @TempDir
    static Path tmp;
    static Path campaign;
    static Map<String, String> before;

    @BeforeAll
    static void copyDemo() throws Exception {
        campaign = CliSafetyTest.demo(tmp);
        before = hashes(campaign.getParent());
    }

    /** Every numeric option of every command, as "command --option". */
    static List<String> numericOptions() {
        List<String> out = new ArrayList<>();
        walk(Main.commandLine(), out);
        return out;
    }

    private static void walk(CommandLine cl, List<String> out) {
        CommandSpec spec = cl.getCommandSpec();
        for (OptionSpec o : spec.options()) {
            Class<?> t = o.type();
            boolean numeric = NUMERIC.contains(t) || (o.auxiliaryTypes().length > 0 && NUMERIC.contains(o.auxiliaryTypes()[0])
                    && (List.class.isAssignableFrom(t) || t.isArray()));
            if (numeric) {
                out.add(OptionRanges.commandName(spec) + " " + o.longestName());
                assertTrue(OptionRanges.of(spec, o).isPresent(), "no range for " + OptionRanges.commandName(spec) + " "
                        + o.longestName() + "; add one to OptionRanges");
                String dv = o.defaultValue();
                if (dv != null) {
                    for (String part : dv.split(",")) {
                        assertTrue(OptionRanges.of(spec, o).get().contains(Double.parseDouble(part)),
                                "the default " + dv + " of " + o.longestName() + " lies in its range");
                    }
                }
            }
        }
        cl.getSubcommands().values().forEach(sub -> walk(sub, out));
    }

    @Test
    void everyNumericOptionOfEveryCommandHasARangeThatHoldsItsDefault() {
        List<String> found = numericOptions();
        // the walk must see the options this table was written against, so it cannot pass vacuously
        for (String known : List.of("propose --batch", "propose --explore", "propose --within-runs", "map --grid",
                "map --temperature-uncertainty", "bench --seeds", "bench --threads", "bench --sizes",
                "flux ratio --bep-v", "flux ratio --t-iii", "flux rheed --period", "flux rheed --periods",
                "flux rheed --span", "fit --seed", "validate --seed", "report --seed", "rank --seed", "map --seed")) {
            assertTrue(found.contains(known), known + " in " + found);
        }
    }

    /**
     * Each row: the arguments (| separates them; CAMPAIGN stands for the demo campaign, EMPTY for
     * "" and BLANK for " ") and the message expected. The ranges are the project's own choices, documented in OptionRanges.
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = ';', value = {
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--grid|0; --grid must be a whole number from 5 to 200 (cells per axis), found 0",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--grid|1e9; --grid must be a whole number from 5 to 200 (cells per axis), found '1e9'",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--grid|1000000000; --grid must be a whole number from 5 to 200 (cells per axis), found 1000000000",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--temperature-uncertainty|-3; --temperature-uncertainty must be a number from 0 to 100 (kelvin, one sd), found -3.0",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--temperature-uncertainty|500; --temperature-uncertainty must be a number from 0 to 100",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--temperature-uncertainty|NaN; --temperature-uncertainty must be a number from 0 to 100",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--seed|x; --seed must be a whole number from -9223372036854775808 to 9223372036854775807 (any 64-bit seed), found 'x'",
            "propose|CAMPAIGN|--batch|0; --batch must be a whole number from 1 to 100 (recipes), found 0",
            "propose|CAMPAIGN|--batch|10^6; --batch must be a whole number from 1 to 100 (recipes), found '10^6'",
            "propose|CAMPAIGN|--batch|1000000; --batch must be a whole number from 1 to 100 (recipes), found 1000000",
            "propose|CAMPAIGN|--explore|-1; --explore must be a number from 0 to 10 (standard deviations of optimism), found -1.0",
            "propose|CAMPAIGN|--explore|Infinity; --explore must be a number from 0 to 10",
            "propose|CAMPAIGN|--within-runs|11; --within-runs must be a number from 0 to 10 (a fraction of each setting's logged span), found 11.0",
            "propose|CAMPAIGN|--within-runs|-0.5; --within-runs must be a number from 0 to 10",
            "propose|CAMPAIGN|--seed|1.5; --seed must be a whole number from -9223372036854775808 to 9223372036854775807",
            "propose|CAMPAIGN|--seed|99999999999999999999; --seed must be a whole number from -9223372036854775808",
            "rank|CAMPAIGN|--candidates|c.csv|--seed|seven; --seed must be a whole number",
            "fit|CAMPAIGN|--seed|1e3; --seed must be a whole number",
            "validate|CAMPAIGN|--seed|12a; --seed must be a whole number",
            "report|CAMPAIGN|--seed|one; --seed must be a whole number",
            "bench|--seeds|0; --seeds must be a whole number from 1 to 1000 (seeds per problem and strategy), found 0",
            "bench|--seeds|5000; --seeds must be a whole number from 1 to 1000",
            "bench|--threads|0; --threads must be a whole number from 1 to 256 (worker threads), found 0",
            "bench|--threads|1024; --threads must be a whole number from 1 to 256",
            "bench|--speed|--sizes|30,0; --sizes must be a whole number from 1 to 100000 (runs in each log), found 0",
            "bench|--speed|--sizes|1e6; --sizes must be a whole number from 1 to 100000 (runs in each log), found '1e6'",
            "flux|ratio|--group-v|As4|--bep-v|0|--group-iii|Ga|--bep-iii|5e-7; --bep-v must be a number greater than 0 (a pressure in --unit), found 0.0",
            "flux|ratio|--group-v|As4|--bep-v|1e-5|--group-iii|Ga|--bep-iii|-5e-7; --bep-iii must be a number greater than 0",
            "flux|ratio|--group-v|As4|--bep-v|5|--group-iii|Ga|--bep-iii|5e-7; --bep-v must be a number greater than 0 and at most 0.00750 Torr (1.00 Pa",
            "flux|ratio|--group-v|As4|--bep-v|5|--group-iii|Ga|--bep-iii|5e-7|--unit|Pa; --bep-v must be a number greater than 0 and at most 1.00 Pa",
            "flux|ratio|--group-v|As4|--bep-v|1e-5|--group-iii|Ga|--bep-iii|5e-7|--t-v|100; --t-v must be a number from 250 to 2500 (kelvin), found 100.0",
            "flux|ratio|--group-v|As4|--bep-v|1e-5|--group-iii|Ga|--bep-iii|5e-7|--t-iii|1e5; --t-iii must be a number from 250 to 2500 (kelvin)",
            "flux|rheed|--period|0; --period must be a number from 0.01 to 3600 (seconds), found 0.0",
            "flux|rheed|--period|1e5; --period must be a number from 0.01 to 3600 (seconds)",
            "flux|rheed|--periods|0|--span|6; --periods must be a whole number from 1 to 10000 (whole periods), found 0",
            "flux|rheed|--periods|2.5|--span|6; --periods must be a whole number from 1 to 10000 (whole periods), found '2.5'",
            "flux|rheed|--periods|5|--span|0; --span must be a number greater than 0 and at most 86400 (seconds), found 0.0",
            "flux|rheed|--periods|10000|--span|1; --span / --periods must be a period from 0.01 to 3600 s, found 0.0001000 s",
            "propose|CAMPAIGN|--out|EMPTY; --out: the path is empty; expected the name of a file",
            "propose|CAMPAIGN|--out|BLANK; --out: the path is empty; expected the name of a file",
            "map|CAMPAIGN|--x|t_drop|--y|t_cryst|--out|EMPTY; --out: the path is empty; expected the name of a file",
            "rank|CAMPAIGN|--candidates|EMPTY; --candidates: the path is empty; expected the name of a file",
            "report|CAMPAIGN|--out|EMPTY; --out: the path is empty; expected the name of a file",
            "fit|CAMPAIGN|--plot|EMPTY; --plot: the path is empty; expected the name of a file",
            "validate|CAMPAIGN|--plots|EMPTY; --plots: the path is empty; expected the name of a folder",
            "demo|--dir|EMPTY; --dir: the path is empty; expected the name of a folder",
    })
    void outOfRangeValuesAndEmptyPathsAreRefusedWithTheRange(String args, String expected) throws Exception {
        List<String> argv = new ArrayList<>();
        for (String a : args.split("\\|")) {
            argv.add(a.equals("CAMPAIGN") ? campaign.toString() : a.equals("EMPTY") ? "" : a.equals("BLANK") ? " " : a);
        }
        if (!argv.get(0).equals("flux")) {
            argv.add("-q"); // flux has no progress output and no -q
        }
        CliSafetyTest.Outcome o = run(argv.toArray(new String[0]));
        assertRefused(o, expected);
        assertEquals(before, hashes(campaign.getParent()), "no input changed");
    }
}
