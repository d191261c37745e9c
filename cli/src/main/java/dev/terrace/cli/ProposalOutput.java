package dev.terrace.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.propose.Proposals.BeyondRuns;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** Renders proposals and rankings as a table, CSV or JSON. NaN is never printed (JSON null, empty cell, "-"). */
final class ProposalOutput {
    /** What the distance to the nearest run measures. */
    static final String NEAREST_DISTANCE = dev.terrace.cli.report.HtmlReport.NEAREST_DISTANCE;

    /** Marks a recipe setting outside the range of the ok runs in the table; explained by a legend line. */
    static final String BEYOND_MARK = "*";

    private ProposalOutput() {
    }

    static String render(ProposalSet set, Campaign c, String format) throws Exception {
        switch (format) {
            case "json":
                return json(set);
            case "csv":
                return csv(set, c);
            default:
                return table(set, c);
        }
    }

    static void put(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }

    static String json(ProposalSet set) throws Exception {
        ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode root = om.createObjectNode();
        root.put("campaign", set.campaignId());
        root.put("runs_used", set.runsUsed());
        root.put("seed", set.seed());
        root.put("mode", set.mode());
        root.put("explore", set.explore());
        ArrayNode ps = root.putArray("proposals");
        for (Proposal p : set.proposals()) {
            ObjectNode o = ps.addObject();
            o.put("id", p.id());
            o.put("rank", p.rank());
            put(o, "yield", p.yield());
            ObjectNode r = o.putObject("recipe");
            for (Map.Entry<String, Object> e : p.recipe().entrySet()) {
                if (e.getValue() instanceof Double) {
                    put(r, e.getKey(), (Double) e.getValue());
                } else if (e.getValue() == null) {
                    r.putNull(e.getKey());
                } else {
                    r.put(e.getKey(), e.getValue().toString());
                }
            }
            ObjectNode pred = o.putObject("predicted");
            for (Map.Entry<String, NumericPrediction> e : p.numeric().entrySet()) {
                ObjectNode n = pred.putObject(e.getKey());
                NumericPrediction np = e.getValue();
                put(n, "mean", np.mean());
                put(n, "sd", np.sd());
                ArrayNode iv = n.putArray("interval90");
                if (Double.isFinite(np.lo90()) && Double.isFinite(np.hi90())) {
                    iv.add(np.lo90()).add(np.hi90());
                }
                if (np.hasWindow()) {
                    n.put("p_in_window", np.inWindow());
                }
            }
            for (Map.Entry<String, Map<String, Double>> e : p.classes().entrySet()) {
                ObjectNode n = pred.putObject(e.getKey()).putObject("probabilities");
                e.getValue().forEach((k, v) -> put(n, k, v));
            }
            put(o, "p_success", p.success());
            if (p.nearestRun() != null) {
                ObjectNode nr = o.putObject("nearest_run");
                nr.put("run_id", p.nearestRun());
                put(nr, "distance", p.nearestDistance());
            } else {
                o.putNull("nearest_run");
            }
            ObjectNode br = o.putObject("beyond_runs");
            for (Map.Entry<String, BeyondRuns> e : p.beyondRuns().entrySet()) {
                ObjectNode b = br.putObject(e.getKey());
                put(b, "value", e.getValue().value());
                put(b, "runs_min", e.getValue().runsMin());
                put(b, "runs_max", e.getValue().runsMax());
            }
            o.put("inside_box", p.insideBox());
            o.put("keeps_limits", p.keepsLimits());
            o.put("reason", p.reason());
            ArrayNode fl = o.putArray("flags");
            p.flags().forEach(fl::add);
        }
        ArrayNode notes = root.putArray("notes");
        set.notes().forEach(notes::add);
        // long logs: which GPs trained on a subset of the runs, and on how many (empty when none)
        ObjectNode gt = root.putObject("gp_subsets");
        set.gpSubsets().forEach((name, sub) -> {
            ObjectNode g = gt.putObject(name);
            g.put("method", dev.terrace.core.surrogate.TrainingSubset.METHOD);
            g.put("runs", sub.size());
            g.put("of", sub.total());
            g.put("focus_runs", sub.focusRuns());
            put(g, "cover_radius", sub.coverRadius());
        });
        return om.writeValueAsString(root);
    }

    static String cell(String s) {
        if (s.contains(",") || s.contains("\"") || s.contains("\n")) {
            return "\"" + s.replace("\"", "\"\"") + "\"";
        }
        return s;
    }

    static String num(double v) {
        return Double.isFinite(v) ? Format.num(v) : "";
    }

    static String csv(ProposalSet set, Campaign c) {
        List<String> head = new ArrayList<>(List.of("rank", "id", "yield"));
        for (ParameterSpec p : c.parameters()) {
            head.add(p.name());
        }
        for (OutcomeSpec o : c.outcomes()) {
            if (o.isClass()) {
                for (String k : o.classes()) {
                    head.add(o.name() + "_p_" + k);
                }
            } else {
                head.add(o.name() + "_mean");
                head.add(o.name() + "_sd");
                head.add(o.name() + "_lo90");
                head.add(o.name() + "_hi90");
            }
        }
        head.addAll(List.of("p_success", "nearest_run", "distance", "reason", "flags", "beyond_runs"));
        StringBuilder sb = new StringBuilder();
        sb.append("# Terrace ").append(set.mode()).append(" for campaign ").append(set.campaignId())
                .append(", seed ").append(set.seed()).append("; predictions, not measurements\n");
        sb.append(String.join(",", head)).append('\n');
        for (Proposal p : set.proposals()) {
            List<String> row = new ArrayList<>();
            row.add(String.valueOf(p.rank()));
            row.add(p.id());
            row.add(num(p.yield()));
            for (ParameterSpec ps : c.parameters()) {
                Object v = p.recipe().get(ps.name());
                row.add(v instanceof Double ? (Double.isFinite((Double) v) ? Format.setting((Double) v) : "")
                        : (v == null ? "" : cell(v.toString())));
            }
            for (OutcomeSpec o : c.outcomes()) {
                if (o.isClass()) {
                    Map<String, Double> m = p.classes().getOrDefault(o.name(), Map.of());
                    for (String k : o.classes()) {
                        row.add(num(m.getOrDefault(k, Double.NaN)));
                    }
                } else {
                    NumericPrediction np = p.numeric().get(o.name());
                    if (np == null) {
                        row.addAll(List.of("", "", "", ""));
                        continue;
                    }
                    row.add(num(np.mean()));
                    row.add(num(np.sd()));
                    row.add(num(np.lo90()));
                    row.add(num(np.hi90()));
                }
            }
            row.add(num(p.success()));
            row.add(p.nearestRun() == null ? "" : p.nearestRun());
            row.add(num(p.nearestDistance()));
            row.add(cell(p.reason()));
            row.add(cell(String.join("; ", p.flags())));
            row.add(cell(String.join(";", p.beyondRuns().keySet())));
            sb.append(String.join(",", row)).append('\n');
        }
        return sb.toString();
    }

    static String table(ProposalSet set, Campaign c) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%s for campaign %s: %d runs used, seed %d, explore %.2f%n",
                set.mode().equals("ranking") ? "Ranking" : "Proposals (" + set.mode() + ")", set.campaignId(),
                set.runsUsed(), set.seed(), set.explore()));
        for (String n : set.notes()) {
            sb.append("  note: ").append(n).append('\n');
        }
        if (set.proposals().stream().anyMatch(p -> !p.beyondRuns().isEmpty())) {
            sb.append("  ").append(BEYOND_MARK).append(" = outside the range of the ok runs; the prediction there extrapolates\n");
        }
        set.proposals().stream().filter(p -> p.nearestRun() != null).findFirst().ifPresent(p -> sb.append(String.format(
                Locale.ROOT, "  \"nearest run %s at %.2f\" = the logged run closest to the recipe, and how far: %s%n",
                p.nearestRun(), p.nearestDistance(), NEAREST_DISTANCE)));
        for (Proposal p : set.proposals()) {
            sb.append('\n');
            sb.append(String.format(Locale.ROOT, "#%d  %s  yield %.2f  (P run succeeds %.2f)%n", p.rank(), p.id(),
                    p.yield(), p.success()));
            StringBuilder r = new StringBuilder("    recipe: ");
            boolean first = true;
            for (ParameterSpec ps : c.parameters()) {
                Object v = p.recipe().get(ps.name());
                r.append(first ? "" : ", ").append(ps.name()).append(' ')
                        .append(v instanceof Double ? Format.setting((Double) v) : v)
                        .append(ps.isCategorical() ? "" : " " + ps.unit().symbol())
                        .append(p.beyondRuns().containsKey(ps.name()) ? BEYOND_MARK : "");
                first = false;
            }
            sb.append(r).append('\n');
            for (OutcomeSpec o : c.outcomes()) {
                if (o.isClass()) {
                    Map<String, Double> m = p.classes().get(o.name());
                    StringBuilder cl = new StringBuilder();
                    m.forEach((k, v) -> cl.append(cl.length() == 0 ? "" : ", ").append(k)
                            .append(String.format(Locale.ROOT, " %.2f", v)));
                    sb.append("    ").append(Format.pad(o.name(), 14)).append(cl).append('\n');
                } else {
                    NumericPrediction np = p.numeric().get(o.name());
                    if (np == null) {
                        sb.append("    ").append(Format.pad(o.name(), 14)).append("no prediction (never measured)\n");
                        continue;
                    }
                    sb.append("    ").append(Format.pad(o.name(), 14)).append(Format.num(np.mean())).append(' ')
                            .append(o.unit().symbol()).append("  sd ").append(Format.num(np.sd()))
                            .append("  90 % ").append(Format.num(np.lo90())).append(" to ").append(Format.num(np.hi90()))
                            .append(np.hasWindow()
                                    ? String.format(Locale.ROOT, "  P(in target) %.2f", np.inWindow()) : "")
                            .append('\n');
                }
            }
            sb.append("    why: ").append(p.reason()).append('\n');
            for (String f : p.flags()) {
                sb.append("    ! ").append(f).append('\n');
            }
        }
        return sb.toString();
    }
}
