package dev.terrace.core;

import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.runlog.Censored;
import dev.terrace.core.runlog.Run;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * How many cells of each numeric outcome the run log records only as a bound ({@code <X} below,
 * {@code >X} above), with the range of those bounds, for {@code terrace check}. Fits use them through
 * the censored-normal (Tobit) likelihood; the count tells a grower how much of the log that is.
 *
 * @param outcome the outcome column; never null
 * @param unit    its unit symbol
 * @param below   cells written {@code <X} (or {@code <=X})
 * @param above   cells written {@code >X}
 * @param minBound smallest bound over both sides
 * @param maxBound largest bound over both sides
 * @since 0.2
 */
public record CensoredCells(String outcome, String unit, int below, int above, double minBound, double maxBound) {

    /** Checks the invariants. */
    public CensoredCells {
        Objects.requireNonNull(outcome);
        Objects.requireNonNull(unit);
        if (below < 0 || above < 0 || below + above == 0) {
            throw new IllegalArgumentException("a censored summary needs at least one censored cell");
        }
        if (!(minBound <= maxBound)) {
            throw new IllegalArgumentException("bound range " + minBound + " to " + maxBound + " is empty");
        }
    }

    /**
     * @param lc a loaded campaign
     * @return one summary per numeric outcome with at least one censored cell, in campaign order
     *         (failed runs included: the cell is what the log says); never null, possibly empty
     */
    public static List<CensoredCells> of(LoadedCampaign lc) {
        List<CensoredCells> out = new ArrayList<>();
        for (OutcomeSpec o : lc.campaign().outcomes()) {
            if (o.isClass()) {
                continue;
            }
            int below = 0;
            int above = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (Run r : lc.runLog().runs()) {
                var c = r.censored(o.name());
                if (c.isEmpty()) {
                    continue;
                }
                if (c.get().side() == Censored.Side.BELOW) {
                    below++;
                } else {
                    above++;
                }
                lo = Math.min(lo, c.get().bound());
                hi = Math.max(hi, c.get().bound());
            }
            if (below + above > 0) {
                out.add(new CensoredCells(o.name(), o.unit().symbol(), below, above, lo, hi));
            }
        }
        return out;
    }
}
