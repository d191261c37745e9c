package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.journal.Journal;
import dev.terrace.core.journal.JournalEntry;
import dev.terrace.core.journal.JournalProposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.runlog.RunLogAppender;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Collectors;

/** The one line after {@code propose}, {@code check} and {@code record} that says what to do next. */
final class NextStep {

    /** How every next-step line starts. */
    static final String PREFIX = "Next: ";

    private NextStep() {
    }

    /** After propose. */
    static String afterPropose(Path campaign, ProposalSet set, boolean journaled) {
        if (set.proposals().isEmpty()) {
            return PREFIX + "no recipe fits the boxes and limits; widen them in " + campaign + " and propose again";
        }
        var top = set.proposals().get(0);
        String how = journaled
                ? "terrace record " + campaign + " --proposal " + top.id() + " OUTCOME=VALUE ..."
                : "terrace record " + campaign + " SETTING=VALUE ... OUTCOME=VALUE ... proposal=" + top.id()
                + " (this batch was not journaled, so --proposal cannot fill the recipe)";
        if (set.mode().equals("space-filling start")) {
            return PREFIX + "grow these " + set.proposals().size() + " space-filling recipes (too few runs with"
                    + " outcomes for predictions yet) and record each, for example: " + how;
        }
        return PREFIX + String.format(Locale.ROOT, "grow %s (rank 1, predicted yield %.2f) and record it: ",
                top.id(), top.yield()) + how;
    }

    /** After check. */
    static String afterCheck(Path campaign, LoadedCampaign lc, Journal journal) {
        Set<String> grown = lc.runLog().runs().stream().map(Run::proposal).filter(Objects::nonNull)
                .collect(Collectors.toSet());
        JournalEntry last = journal.latest().orElse(null);
        if (last != null) {
            for (JournalProposal p : last.proposals()) {
                if (!grown.contains(p.id())) {
                    return PREFIX + String.format(Locale.ROOT, "grow %s (rank %d of the latest batch, predicted"
                            + " yield %.2f, not grown yet) and record it: terrace record %s --proposal %s"
                            + " OUTCOME=VALUE ...", p.id(), p.rank(), p.yield(), campaign, p.id());
                }
            }
        }
        long measured = lc.runLog().okRuns().stream().filter(r -> measuredAnything(lc, r)).count();
        int plain = lc.campaign().parameters().size() + 1;
        if (measured < plain) {
            return PREFIX + "run terrace propose " + campaign + "; with " + measured + " ok run"
                    + (measured == 1 ? "" : "s") + " with outcomes (fewer than settings + 1 = " + plain + ", or"
                    + " about half that when growth models fit) it proposes a space-filling start, and"
                    + " predictions sharpen as you record more runs";
        }
        return PREFIX + "run terrace propose " + campaign + " for the next batch"
                + (last == null ? "" : " (every proposal of the latest batch has been grown)");
    }

    /** After record. */
    static String afterRecord(Path campaign, RunLogAppender.Appended a, boolean followed) {
        return PREFIX + "terrace check " + campaign + (followed ? " shows how run " + a.runId()
                + " compares with its prediction; then" : " checks the log; then") + " terrace propose "
                + campaign + " uses it for the next batch";
    }

    private static boolean measuredAnything(LoadedCampaign lc, Run r) {
        return lc.campaign().outcomes().stream().anyMatch(o -> r.number(o.name()).isPresent()
                || r.category(o.name()).isPresent() || r.censored(o.name()).isPresent());
    }
}
