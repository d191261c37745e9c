package dev.terrace.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.campaign.TemperatureOffset;
import dev.terrace.core.fit.CampaignFit;
import dev.terrace.core.fit.OffsetResult;
import dev.terrace.core.fit.ParameterPrior;
import dev.terrace.core.fit.PriorCheck;

import java.io.PrintWriter;
import java.util.Locale;

/** The parts of {@code terrace fit}'s output about the thermocouple offset and earlier-series priors. */
final class FitExtras {

    private FitExtras() {
    }

    /** One line for {@code check} and {@code fit}: the points' offset, its uncertainty and how many points. */
    static String offsetLine(TemperatureOffset t) {
        if (!t.isCalibrated()) {
            return "no calibration points: substrate temperatures used as read";
        }
        return String.format(Locale.ROOT, "%+.1f K +/- %.1f K (1 sd) from %d calibration point%s%s", t.offsetK(),
                t.uncertaintyK(), t.pointsUsed(), t.pointsUsed() == 1 ? "" : "s",
                Double.isFinite(t.birgeRatio()) ? String.format(Locale.ROOT, ", Birge ratio %.2f%s", t.birgeRatio(),
                        t.birgeRatio() > 1 ? ": the points disagree, uncertainty scaled up" : "") : "");
    }

    static void printOffset(CampaignFit f, PrintWriter out) {
        OffsetResult o = f.offset();
        if (!o.isCalibrated()) {
            return;
        }
        out.println(String.format(Locale.ROOT, "Thermocouple offset %+.1f K added to every substrate-temperature reading"
                + " (95 %% %+.1f to %+.1f K)", o.value(), o.lo(), o.hi()));
        out.println("  calibration: " + offsetLine(o.calibration()));
        out.println("  " + o.method());
        out.println();
    }

    static void printPriors(CampaignFit f, PrintWriter out) {
        if (f.priors().isEmpty() && f.notes().isEmpty()) {
            return;
        }
        out.println();
        out.println("Priors from earlier series (95 % intervals; 'these runs' is the fit without any prior):");
        for (PriorCheck c : f.checks()) {
            ParameterPrior p = c.prior();
            String unit = p.unit().isEmpty() ? "" : " " + p.unit();
            String data = Double.isFinite(c.dataValue()) ? range(c.dataValue(), c.dataLo(), c.dataHi())
                    : "cannot fit it alone";
            String combined = Double.isFinite(c.lo()) ? range(c.value(), c.lo(), c.hi())
                    : Format.num(c.value()) + " (held)";
            out.println("  " + c.model() + " " + p.parameter() + (unit.isEmpty() ? "" : " (" + p.unit() + ")")
                    + (c.conflict() ? "   CONTRADICTED" : ""));
            out.println("    prior " + range(p.value(), p.lo(), p.hi()) + " | these runs " + data
                    + " | combined " + combined);
            if (c.conflict()) {
                out.println("    ! " + conflictText(c));
            }
            out.println("    prior from " + p.source());
        }
        for (String n : f.notes()) {
            out.println("  note: " + n);
        }
    }

    static String conflictText(PriorCheck c) {
        return String.format(Locale.ROOT, "these runs contradict the prior (z = %.1f, beyond %.0f combined sd): the"
                + " combined value leans on an earlier series the new runs disagree with; check what changed in the"
                + " chamber or remove the prior", c.z(), PriorCheck.CONFLICT_Z);
    }

    private static String range(double v, double lo, double hi) {
        return Format.num(v) + " (" + Format.num(lo) + " to " + Format.num(hi) + ")";
    }

    static void json(CampaignFit f, ObjectNode root) {
        OffsetResult o = f.offset();
        ObjectNode t = root.putObject("temperature_offset");
        t.put("value_k", o.value());
        if (o.isCalibrated()) {
            t.putArray("ci95_k").add(o.lo()).add(o.hi());
        } else {
            t.putNull("ci95_k");
        }
        t.put("fitted", o.fitted());
        t.put("method", o.method());
        ObjectNode cal = t.putObject("calibration");
        TemperatureOffset tc = o.calibration();
        cal.put("points", tc.pointsUsed());
        cal.put("offset_k", tc.offsetK());
        putNumber(cal, "uncertainty_k", tc.uncertaintyK());
        putNumber(cal, "birge_ratio", tc.birgeRatio());
        ArrayNode pr = root.putArray("priors");
        for (PriorCheck c : f.checks()) {
            ParameterPrior p = c.prior();
            ObjectNode n = pr.addObject();
            n.put("model", c.model());
            n.put("parameter", p.parameter());
            n.put("unit", p.unit());
            n.put("fitting_scale", p.logScale() ? "log10" : "linear");
            ObjectNode po = n.putObject("prior");
            po.put("value", p.value());
            po.putArray("ci95").add(p.lo()).add(p.hi());
            po.put("mean_fitting_scale", p.meanU());
            po.put("sd_fitting_scale", p.sdU());
            po.put("source", p.source());
            if (Double.isFinite(c.dataValue())) {
                ObjectNode d = n.putObject("data");
                d.put("value", c.dataValue());
                d.putArray("ci95").add(c.dataLo()).add(c.dataHi());
            } else {
                n.putNull("data");
            }
            ObjectNode co = n.putObject("combined");
            co.put("value", c.value());
            if (Double.isFinite(c.lo())) {
                co.putArray("ci95").add(c.lo()).add(c.hi());
            } else {
                co.putNull("ci95");
            }
            putNumber(n, "z", c.z());
            n.put("conflict", c.conflict());
            if (c.conflict()) {
                n.put("warning", conflictText(c));
            }
        }
        ArrayNode notes = root.putArray("prior_notes");
        f.notes().forEach(notes::add);
    }

    private static void putNumber(ObjectNode n, String key, double v) {
        if (Double.isFinite(v)) {
            n.put(key, v);
        } else {
            n.putNull(key);
        }
    }
}
