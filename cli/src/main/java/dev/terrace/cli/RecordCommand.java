package dev.terrace.cli;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.journal.Journal;
import dev.terrace.core.runlog.RunLogAppender;
import dev.terrace.core.runlog.RunLogReader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code terrace record CAMPAIGN [--proposal P-...] NAME=VALUE...}: appends one run to the run log,
 * the only command that writes it.
 */
@Command(name = "record", mixinStandardHelpOptions = true,
        description = {"Append one growth run to the run log: its settings (from a proposal with --proposal, or",
                "given one by one), measured outcomes, status, date and notes, as NAME=VALUE arguments.",
                "The row is checked with the same rules as 'check' first; existing lines are never changed."})
final class RecordCommand implements Callable<Integer> {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    CampaignInput input = new CampaignInput();

    @Parameters(index = "1..*", paramLabel = "NAME=VALUE",
            description = {"A cell of the new row: a setting (overrides the proposal's value, for when the chamber",
                    "did not hit it exactly), an outcome (<X or >X for a value below or above what could be",
                    "measured), status=ok|failed, date=YYYY-MM-DD (default: today, when the log has a date",
                    "column), notes=TEXT, run_id=ID (default: the next free id)."})
    List<String> values = new ArrayList<>();

    @Option(names = "--proposal", paramLabel = "P-ID",
            description = "Take the recipe from this proposal in the campaign's journal and write its id in the"
                    + " proposal column.")
    String proposal;

    @Option(names = "--dry-run", description = "Check the new row and show it; write nothing.")
    boolean dryRun;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        java.time.Clock clock = Main.clock(spec);
        Map<String, String> given = parse(values);
        // recording fits no model, so a log of any length (within the read limits) takes a new run
        LoadedCampaign lc = LoadedCampaign.openAnySize(input.file, Registries.load(input.global, err));
        Campaign c = lc.campaign();
        Map<String, String> cells = new LinkedHashMap<>();
        List<String> overridden = new ArrayList<>();
        Journal.Found followed = null;
        if (proposal != null) {
            if (given.containsKey(RunLogReader.PROPOSAL) && !given.get(RunLogReader.PROPOSAL).equals(proposal)) {
                throw new UsageException("--proposal " + proposal + " and proposal=" + given.get(RunLogReader.PROPOSAL)
                        + " disagree; give the id once");
            }
            followed = find(c, proposal);
            for (ParameterSpec p : c.parameters()) {
                Object v = followed.proposal().recipe().get(p.name());
                if (v == null) {
                    continue;
                }
                String text = v instanceof Double ? Format.setting((Double) v) : v.toString();
                if (given.containsKey(p.name()) && !given.get(p.name()).equals(text)) {
                    overridden.add(p.name() + " " + given.get(p.name()) + " (proposed " + text + ")");
                }
                cells.put(p.name(), text);
            }
            cells.put(RunLogReader.PROPOSAL, proposal);
        }
        cells.putAll(given);
        Map<String, String> ifColumn = Map.of(RunLogReader.DATE, LocalDate.now(clock).toString());
        RunLogAppender.Appended a;
        try {
            a = dryRun ? RunLogAppender.plan(c, cells, ifColumn) : RunLogAppender.append(c, cells, ifColumn);
        } catch (InputException e) {
            err.println("terrace: nothing was recorded; " + c.runs() + " is unchanged. Problems:");
            throw e;
        }
        out.println((dryRun ? "Would record" : "Recorded") + " run " + a.runId() + " as line " + a.line() + " of "
                + a.file() + ":");
        out.println("  " + a.row());
        if (followed != null) {
            out.println("  following " + followed.proposal().id() + " (rank " + followed.proposal().rank()
                    + " of the batch of " + followed.entry().time() + ", predicted yield "
                    + String.format(java.util.Locale.ROOT, "%.2f", followed.proposal().yield()) + ")");
        }
        for (String o : overridden) {
            out.println("  setting as grown: " + o);
        }
        DiagnosticLines.print(err, a.warnings());
        if (!dryRun) {
            out.println(NextStep.afterRecord(input.file, a, followed != null));
            if (!input.global.quiet) {
                err.println(dev.terrace.core.Cautions.pointer(c));
            }
        }
        out.flush();
        err.flush();
        return 0;
    }

    private Journal.Found find(Campaign c, String id) throws Exception {
        Journal j = Journal.read(c.journal(), c.id());
        return j.find(id, null).orElseThrow(() -> {
            String latest = j.latest().map(e -> "; the latest batch (" + e.time() + ") holds "
                    + String.join(", ", e.proposals().stream().map(p -> p.id()).toList())).orElse(
                    "; the journal holds no batch yet (run terrace propose first, without --no-journal)");
            return new InputException(Diagnostic.error(c.journal(), 0, 0, "proposal " + id
                    + " is not in the proposal journal" + latest));
        });
    }

    /** NAME=VALUE arguments by name, in order; a name given twice is a usage error. */
    static Map<String, String> parse(List<String> args) {
        Map<String, String> m = new LinkedHashMap<>();
        for (String a : args) {
            int eq = a.indexOf('=');
            if (eq <= 0) {
                throw new UsageException("'" + a + "' is not NAME=VALUE; expected for example t_drop=250 or"
                        + " status=failed (a value with spaces in quotes: notes=\"As cell refilled\")");
            }
            String name = a.substring(0, eq).strip();
            if (m.containsKey(name)) {
                throw new UsageException(name + " is given twice (" + name + "=" + m.get(name) + " and " + a
                        + "); give each column once");
            }
            m.put(name, a.substring(eq + 1).strip());
        }
        return m;
    }
}
