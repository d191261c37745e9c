package dev.terrace.core.journal;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One journal entry as one line of JSON, and back. The layout is documented in DEVELOPERS.md; a
 * reader refuses lines whose {@value #VERSION_KEY} it does not know.
 */
final class JournalCodec {

    /** Key of the layout version in every line. */
    static final String VERSION_KEY = "terrace_journal";
    /** The layout version written. */
    static final int VERSION = 1;

    private static final ObjectMapper JSON = new ObjectMapper();

    private JournalCodec() {
    }

    /** @return the entry as one line of JSON, without a line end */
    static String toLine(JournalEntry e) {
        ObjectNode root = JSON.createObjectNode();
        root.put(VERSION_KEY, VERSION);
        root.put("time", e.time().toString());
        root.put("campaign", e.campaignId());
        root.put("campaign_sha256", e.campaignSha256());
        root.put("run_log_sha256", e.runLogSha256());
        root.put("runs_used", e.runsUsed());
        root.put("seed", e.seed());
        root.put("explore", e.explore());
        root.put("mode", e.mode());
        var ps = root.putArray("proposals");
        for (JournalProposal p : e.proposals()) {
            ObjectNode o = ps.addObject();
            o.put("id", p.id());
            o.put("rank", p.rank());
            o.put("yield", p.yield());
            ObjectNode r = o.putObject("recipe");
            p.recipe().forEach((k, v) -> {
                if (v instanceof Double d) {
                    r.put(k, d);
                } else {
                    r.put(k, (String) v);
                }
            });
            ObjectNode pred = o.putObject("predicted");
            p.predicted().forEach((k, v) -> {
                ObjectNode n = pred.putObject(k);
                n.put("mean", v.mean());
                n.put("sd", v.sd());
                n.put("lo90", v.lo90());
                n.put("hi90", v.hi90());
            });
            ObjectNode cl = o.putObject("classes");
            p.classes().forEach((k, v) -> {
                ObjectNode n = cl.putObject(k);
                v.forEach(n::put);
            });
        }
        try {
            return JSON.writeValueAsString(root);
        } catch (JsonProcessingException ex) {
            throw new IllegalStateException("a journal entry could not be written as JSON", ex);
        }
    }

    /**
     * @param line one journal line, without its line end
     * @param n    its 1-based line number
     * @return the entry
     * @throws IllegalArgumentException naming what is wrong when the line is not a journal entry
     */
    static JournalEntry fromLine(String line, int n) {
        JsonNode root;
        try {
            root = JSON.readTree(line);
        } catch (JsonProcessingException ex) {
            throw new IllegalArgumentException("not complete JSON (" + ex.getOriginalMessage() + ")");
        }
        if (root == null || !root.isObject()) {
            throw new IllegalArgumentException("not a JSON object");
        }
        JsonNode v = root.get(VERSION_KEY);
        if (v == null || !v.canConvertToInt()) {
            throw new IllegalArgumentException("no '" + VERSION_KEY + "' version number");
        }
        if (v.asInt() != VERSION) {
            throw new IllegalArgumentException("layout version " + v.asText() + " is not known to this Terrace"
                    + " (it reads version " + VERSION + "); a newer Terrace wrote it");
        }
        try {
            Instant time = Instant.parse(text(root, "time"));
            List<JournalProposal> ps = new ArrayList<>();
            for (JsonNode o : array(root, "proposals")) {
                Map<String, Object> recipe = new LinkedHashMap<>();
                for (Iterator<Map.Entry<String, JsonNode>> it = object(o, "recipe").fields(); it.hasNext(); ) {
                    Map.Entry<String, JsonNode> f = it.next();
                    if (f.getValue().isNumber()) {
                        recipe.put(f.getKey(), f.getValue().asDouble());
                    } else if (f.getValue().isTextual()) {
                        recipe.put(f.getKey(), f.getValue().asText());
                    } else {
                        throw new IllegalArgumentException("setting '" + f.getKey() + "' is neither a number nor a choice");
                    }
                }
                Map<String, JournalProposal.Predicted> pred = new LinkedHashMap<>();
                for (Iterator<Map.Entry<String, JsonNode>> it = object(o, "predicted").fields(); it.hasNext(); ) {
                    Map.Entry<String, JsonNode> f = it.next();
                    JsonNode q = f.getValue();
                    pred.put(f.getKey(), new JournalProposal.Predicted(number(q, "mean"), number(q, "sd"),
                            number(q, "lo90"), number(q, "hi90")));
                }
                Map<String, Map<String, Double>> classes = new LinkedHashMap<>();
                for (Iterator<Map.Entry<String, JsonNode>> it = object(o, "classes").fields(); it.hasNext(); ) {
                    Map.Entry<String, JsonNode> f = it.next();
                    Map<String, Double> probs = new LinkedHashMap<>();
                    for (Iterator<Map.Entry<String, JsonNode>> c = f.getValue().fields(); c.hasNext(); ) {
                        Map.Entry<String, JsonNode> k = c.next();
                        probs.put(k.getKey(), k.getValue().asDouble());
                    }
                    classes.put(f.getKey(), probs);
                }
                ps.add(new JournalProposal(text(o, "id"), (int) number(o, "rank"), number(o, "yield"), recipe, pred,
                        classes));
            }
            return new JournalEntry(time, text(root, "campaign"), text(root, "campaign_sha256"),
                    text(root, "run_log_sha256"), (int) number(root, "runs_used"), integer(root, "seed"),
                    number(root, "explore"), text(root, "mode"), ps, n);
        } catch (DateTimeParseException ex) {
            throw new IllegalArgumentException("'time' is not an ISO 8601 instant such as 2026-05-17T09:30:00Z");
        }
    }

    private static String text(JsonNode o, String key) {
        JsonNode v = o.get(key);
        if (v == null || !v.isTextual()) {
            throw new IllegalArgumentException("'" + key + "' is missing or not text");
        }
        return v.asText();
    }

    private static double number(JsonNode o, String key) {
        JsonNode v = o.get(key);
        if (v == null || !v.isNumber()) {
            throw new IllegalArgumentException("'" + key + "' is missing or not a number");
        }
        return v.asDouble();
    }

    private static long integer(JsonNode o, String key) {
        JsonNode v = o.get(key);
        if (v == null || !v.isIntegralNumber() || !v.canConvertToLong()) {
            throw new IllegalArgumentException("'" + key + "' is missing or not a whole number");
        }
        return v.asLong();
    }

    private static JsonNode object(JsonNode o, String key) {
        JsonNode v = o.get(key);
        if (v == null || !v.isObject()) {
            throw new IllegalArgumentException("'" + key + "' is missing or not an object");
        }
        return v;
    }

    private static JsonNode array(JsonNode o, String key) {
        JsonNode v = o.get(key);
        if (v == null || !v.isArray()) {
            throw new IllegalArgumentException("'" + key + "' is missing or not a list");
        }
        return v;
    }
}
