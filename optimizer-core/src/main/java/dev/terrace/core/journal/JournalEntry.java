package dev.terrace.core.journal;

import dev.terrace.core.propose.Proposals.ProposalSet;

import java.time.Instant;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * One batch of proposals as written to the journal: what was proposed, when, from which inputs.
 *
 * @param time           when the batch was made (UTC); never null
 * @param campaignId     the campaign id; never blank
 * @param campaignSha256 SHA-256 of the campaign file's bytes the batch was made from, 64 lower-case hex
 *                       digits
 * @param runLogSha256   SHA-256 of the run log's bytes, 64 lower-case hex digits
 * @param runsUsed       ok runs with outcomes the surrogates used; not negative
 * @param seed           the seed
 * @param explore        the exploration weight; finite, not negative
 * @param mode           "search" or "space-filling start"; never blank
 * @param proposals      the batch in rank order; copied, never null, possibly empty
 * @param line           the journal line the entry was read from (1-based), 0 for an entry not read
 *                       from a file
 * @since 0.2
 */
public record JournalEntry(Instant time, String campaignId, String campaignSha256, String runLogSha256,
                           int runsUsed, long seed, double explore, String mode, List<JournalProposal> proposals,
                           int line) {

    private static final Pattern SHA256 = Pattern.compile("[0-9a-f]{64}");

    /** Checks the invariants and copies the list. */
    public JournalEntry {
        Objects.requireNonNull(time, "time");
        Objects.requireNonNull(campaignId, "campaignId");
        Objects.requireNonNull(mode, "mode");
        if (campaignId.isBlank() || mode.isBlank()) {
            throw new IllegalArgumentException("blank campaign id or mode");
        }
        if (campaignSha256 == null || !SHA256.matcher(campaignSha256).matches()
                || runLogSha256 == null || !SHA256.matcher(runLogSha256).matches()) {
            throw new IllegalArgumentException("checksums must be 64 lower-case hex digits");
        }
        if (runsUsed < 0 || !(explore >= 0) || !Double.isFinite(explore) || line < 0) {
            throw new IllegalArgumentException("need runsUsed >= 0, a finite explore >= 0 and line >= 0");
        }
        proposals = List.copyOf(proposals);
    }

    /**
     * The journal entry of a batch just proposed.
     *
     * @param set            the batch; never null
     * @param time           when it was made; never null
     * @param campaignSha256 checksum of the campaign file it was made from
     * @param runLogSha256   checksum of the run log it was made from
     * @return the entry (line 0); never null
     */
    public static JournalEntry of(ProposalSet set, Instant time, String campaignSha256, String runLogSha256) {
        Objects.requireNonNull(set, "set");
        return new JournalEntry(time, set.campaignId(), campaignSha256, runLogSha256, set.runsUsed(), set.seed(),
                set.explore(), set.mode(), set.proposals().stream().map(JournalProposal::of).toList(), 0);
    }

    /**
     * @param proposalId a proposal id
     * @return the proposal of that id in this batch, if any
     */
    public Optional<JournalProposal> proposal(String proposalId) {
        return proposals.stream().filter(p -> p.id().equals(proposalId)).findFirst();
    }

    /** @return a copy that says which journal line it came from */
    JournalEntry atLine(int n) {
        return new JournalEntry(time, campaignId, campaignSha256, runLogSha256, runsUsed, seed, explore, mode,
                proposals, n);
    }
}
