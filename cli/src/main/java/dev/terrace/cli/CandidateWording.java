package dev.terrace.cli;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Words {@code terrace rank}'s messages for candidates rather than grown runs: the run-log reader's
 * phrases about measurements become phrases about candidate settings, and each candidate's note or
 * flag names the settings that are missing or outside the campaign's box.
 *
 * @since 0.4
 */
final class CandidateWording {

    /** Reader phrases written for a grown run, and their wording for a candidate. */
    private static final Map<String, String> PHRASES = new LinkedHashMap<>();

    static {
        PHRASES.put("; the run is kept, as it may predate today's box", "; the candidate is still ranked, and flagged");
        PHRASES.put(", or leave the cell empty if it was not measured", "; a candidate needs a number for every setting");
        PHRASES.put(" (leave the cell empty if the value was not measured)", " (a candidate needs a number for every setting)");
        PHRASES.put(" when a value was not measured", " when a value is not known (that candidate is then not ranked)");
        PHRASES.put("each run needs its own identifier", "each candidate needs its own identifier");
    }

    /** The note the ranking gives a candidate without every setting (its wording in {@code Proposer.rank}). */
    static final String NOT_EVERY_SETTING = " does not give every setting; it cannot be ranked";

    /** The flag the ranking gives a candidate outside the box (its wording in {@code Proposer}). */
    static final String OUTSIDE_BOX = "outside the campaign's parameter box";

    private CandidateWording() {
    }

    /**
     * @param diagnostics the candidates reader's diagnostics
     * @return the same diagnostics, worded for candidates; never null
     */
    static List<Diagnostic> reworded(List<Diagnostic> diagnostics) {
        List<Diagnostic> out = new ArrayList<>();
        for (Diagnostic d : diagnostics) {
            String m = d.message();
            for (Map.Entry<String, String> e : PHRASES.entrySet()) {
                m = m.replace(e.getKey(), e.getValue());
            }
            out.add(new Diagnostic(d.file(), d.line(), d.column(), d.severity(), m));
        }
        return out;
    }

    /**
     * Names the settings behind each candidate's "cannot be ranked" note and "outside the box" flag.
     *
     * @param set        the ranking
     * @param c          the campaign
     * @param candidates the candidates as read
     * @return the ranking with those notes and flags naming the settings; never null
     */
    static ProposalSet named(ProposalSet set, Campaign c, List<Run> candidates) {
        Map<String, Run> byId = new LinkedHashMap<>();
        candidates.forEach(r -> byId.putIfAbsent(r.runId(), r));
        List<String> notes = new ArrayList<>();
        for (String n : set.notes()) {
            String id = n.startsWith("candidate ") && n.endsWith(NOT_EVERY_SETTING)
                    ? n.substring("candidate ".length(), n.length() - NOT_EVERY_SETTING.length()) : null;
            Run r = id == null ? null : byId.get(id);
            notes.add(r == null ? n : "candidate " + id + " has no value for " + String.join(", ", missing(c, r))
                    + "; it cannot be ranked");
        }
        List<Proposal> ps = new ArrayList<>();
        for (Proposal p : set.proposals()) {
            Run r = byId.get(p.id());
            List<String> outside = r == null ? List.of() : outsideBox(c, r);
            if (outside.isEmpty() || !p.flags().contains(OUTSIDE_BOX)) {
                ps.add(p);
                continue;
            }
            List<String> flags = new ArrayList<>();
            for (String f : p.flags()) {
                flags.add(f.equals(OUTSIDE_BOX) ? "outside the campaign's box: " + String.join("; ", outside) : f);
            }
            ps.add(new Proposal(p.id(), p.rank(), p.yield(), p.acquisition(), p.recipe(), p.numeric(), p.classes(),
                    p.success(), p.nearestRun(), p.nearestDistance(), p.reason(), flags, p.insideBox(),
                    p.keepsLimits(), p.beyondRuns()));
        }
        return new ProposalSet(set.campaignId(), set.runsUsed(), set.seed(), set.mode(), set.explore(), ps, notes,
                set.gpSubsets());
    }

    /** The settings a candidate leaves out, in campaign order. */
    static List<String> missing(Campaign c, Run r) {
        return c.parameters().stream()
                .filter(p -> p.isCategorical() ? r.category(p.name()).isEmpty() : r.number(p.name()).isEmpty())
                .map(ParameterSpec::name).toList();
    }

    /** Each numeric setting of a candidate outside the box, as "t_drop 400 degC (box 150 to 350 degC)". */
    static List<String> outsideBox(Campaign c, Run r) {
        List<String> out = new ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            if (p.isCategorical() || r.number(p.name()).isEmpty()) {
                continue;
            }
            double v = r.number(p.name()).getAsDouble();
            if (v < p.min() || v > p.max()) {
                String u = p.unit().symbol().isEmpty() ? "" : " " + p.unit().symbol();
                out.add(p.name() + " " + Format.setting(v) + u + " (box " + Format.setting(p.min()) + " to "
                        + Format.setting(p.max()) + u + ")");
            }
        }
        return out;
    }
}
