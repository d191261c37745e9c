package dev.terrace.core;

import dev.terrace.core.campaign.Campaign;

import java.util.ArrayList;
import java.util.List;

/**
 * The usual safety cautions for the growth a campaign describes. They are reminders of common
 * practice, not a safety procedure: local codes, the lab's safety officer and licensed practice
 * take precedence.
 *
 * @since 0.1
 */
public final class Cautions {

    /** The sentence that closes every list of cautions. */
    public static final String DEFER =
            "These are reminders of common practice only; follow your local codes, your lab's safety officer "
                    + "and licensed practice, which take precedence.";

    private Cautions() {
    }

    /**
     * One line that points to the full cautions, for commands other than {@code check} and
     * {@code report} (which print them in full), so they are seen without being repeated.
     *
     * @param campaign a campaign, or null for the general line
     * @return the line; never null
     */
    public static String pointer(Campaign campaign) {
        String v = campaign == null ? null : campaign.surface().groupV();
        String toxic = "As".equals(v) ? "toxic arsenic deposits" : "Sb".equals(v) ? "toxic antimony deposits"
                : "P".equals(v) ? "phosphorus deposits that can ignite in air" : "toxic or reactive deposits";
        return "Safety: growing these recipes involves " + toxic + ", liquid nitrogen, hot parts, vacuum and high"
                + " voltage; 'terrace check', the report and the README give the full cautions, and your local codes,"
                + " your lab's safety officer and licensed practice take precedence.";
    }

    /**
     * @param campaign a campaign, or null for the general list
     * @return cautions relevant to it, most specific first; never null
     */
    public static List<String> forCampaign(Campaign campaign) {
        List<String> out = new ArrayList<>();
        String v = campaign == null ? null : campaign.surface().groupV();
        if (campaign == null || "As".equals(v) || "Sb".equals(v)) {
            out.add("Arsenic and antimony deposits (shrouds, cryopanels, cells, pump oil, exhaust) are toxic; "
                    + "arsenic is a known human carcinogen. Vent with dry N2 only, clean wet (never sweep or blow), "
                    + "use a HEPA vacuum, local exhaust and PPE, and dispose of waste as hazardous.");
        }
        if (campaign == null || "P".equals(v)) {
            out.add("Phosphorus deposits can ignite on contact with air when venting: vent slowly, passivate, "
                    + "keep fire-safety provisions ready.");
        }
        out.add("Liquid nitrogen: asphyxiation risk in closed rooms (fit oxygen monitors), cryogenic burns "
                + "(face shield, cryo gloves); never trap LN2 in a closed line.");
        out.add("Hot parts: effusion cells, substrate heaters and bake-out stay hot long after use; cool down "
                + "before servicing.");
        out.add("Vacuum and high voltage: viewports can implode, venting can over-pressurise; ion pumps, gauges "
                + "and the RHEED gun run at kilovolts. Lock out before opening.");
        return out;
    }
}
