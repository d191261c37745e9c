package dev.terrace.core.runlog;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.units.Unit;
import dev.terrace.spi.Quantity;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Builds the text of a new, empty run log for a campaign. It only builds strings: writing the
 * file (and refusing to overwrite an existing one) is the caller's job.
 *
 * @since 0.1
 */
public final class RunLogWriter {

    private RunLogWriter() {
    }

    /**
     * The text of an empty run log: comment lines giving each column's unit or allowed values,
     * then the header row. {@link RunLogReader} reads it as a log with no runs.
     *
     * @param campaign the campaign; never null
     * @return the file text, lines ending in LF, the last line included; never null
     */
    public static String emptyLog(Campaign campaign) {
        Objects.requireNonNull(campaign, "campaign");
        StringBuilder sb = new StringBuilder();
        sb.append("# Run log of campaign '").append(oneLine(campaign.id())).append("': one row per growth run.")
                .append(" An empty cell means not measured; <X or >X means below or above X (for example <1e8 when nothing was detected).\n");
        List<String> units = new ArrayList<>();
        for (ParameterSpec p : campaign.parameters()) {
            units.add(p.name() + " " + (p.isCategorical() ? String.join("|", p.choices()) : unitText(p.unit())));
        }
        for (OutcomeSpec o : campaign.outcomes()) {
            units.add(o.name() + " " + (o.isClass() ? String.join("|", o.classes()) : unitText(o.unit())));
        }
        if (!units.isEmpty()) {
            sb.append("# Columns: ").append(oneLine(String.join(", ", units))).append(".\n");
        }
        sb.append("# ").append(RunLogReader.STATUS).append(": ok or failed (empty means ok); ")
                .append(RunLogReader.DATE).append(": ISO 8601 such as 2024-05-17; ")
                .append(RunLogReader.PROPOSAL).append(": id of the proposal followed; ")
                .append(RunLogReader.NOTES).append(": free text, in double quotes when it holds a comma.\n");
        sb.append(headerLine(campaign)).append('\n');
        return sb.toString();
    }

    /**
     * The header row for a campaign, without a line end: {@code run_id}, the settings and the
     * outcomes in campaign order, then {@code status,date,proposal,notes}.
     *
     * @param campaign the campaign; never null
     * @return the header row; never null
     */
    public static String headerLine(Campaign campaign) {
        Objects.requireNonNull(campaign, "campaign");
        List<String> names = new ArrayList<>();
        names.add(RunLogReader.RUN_ID);
        campaign.parameters().forEach(p -> names.add(p.name()));
        campaign.outcomes().forEach(o -> names.add(o.name()));
        names.addAll(RunLogReader.RESERVED_COLUMNS.subList(1, RunLogReader.RESERVED_COLUMNS.size()));
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < names.size(); k++) {
            sb.append(k == 0 ? "" : ",").append(cell(names.get(k)));
        }
        return sb.toString();
    }

    /**
     * One cell as RFC 4180 CSV text: quoted (with inner quotes doubled) when it holds a comma, a
     * quote or a line break, starts or ends with a space or tab, or starts with {@code #}.
     *
     * @param text the cell's value; never null
     * @return the text to write between the commas; never null
     */
    static String cell(String text) {
        boolean quote = text.indexOf(',') >= 0 || text.indexOf('"') >= 0 || text.indexOf('\n') >= 0
                || text.indexOf('\r') >= 0 || text.startsWith("#")
                || (!text.isEmpty() && (isBlank(text.charAt(0)) || isBlank(text.charAt(text.length() - 1))));
        return quote ? '"' + text.replace("\"", "\"\"") + '"' : text;
    }

    private static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }

    private static String unitText(Unit unit) {
        return unit.quantity() == Quantity.DIMENSIONLESS ? "(number)" : unit.symbol();
    }

    private static String oneLine(String s) {
        return s.replace('\r', ' ').replace('\n', ' ');
    }
}
