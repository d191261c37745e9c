package dev.terrace.core.campaign;

import dev.terrace.core.DidYouMean;
import dev.terrace.core.units.Units;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.SequenceNode;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static dev.terrace.core.campaign.YamlNodes.pos;

/**
 * Reads the {@code temperature_calibration:} and {@code priors:} sections of a campaign file for
 * {@link CampaignReader}, reporting each bad entry once with its line and column.
 *
 * <pre>
 * temperature_calibration:
 *   fit_offset: true                # optional: the fit may adjust the offset (Gaussian prior)
 *   points:
 *     - event: gaas_oxide_desorption
 *       reading: 562 degC
 *     - event: indium_melting
 *       reading: 151.5 degC
 *       reading_uncertainty: 1 K    # optional, default 2 K
 *     - event: c4x4_to_2x4          # a custom event
 *       reading: 497 degC
 *       true: 505 degC
 *       uncertainty: 8 K
 *       source: own calibration wafer, 2027-03
 * priors: [../spring-series/campaign.yaml]
 * </pre>
 *
 * @since 0.3
 */
final class CalibrationReader {

    static final List<String> SECTION_KEYS = List.of("points", "fit_offset");
    static final List<String> POINT_KEYS = List.of("event", "reading", "reading_uncertainty", "true", "uncertainty",
            "source");
    private static final Pattern QUANTITY = Pattern.compile("\\s*([-+]?[0-9]*\\.?[0-9]+(?:[eE][-+]?[0-9]+)?)\\s*([A-Za-z]\\S*)\\s*");
    private static final Pattern EVENT = Pattern.compile("[A-Za-z][A-Za-z0-9_\\-]*");

    private final YamlNodes yaml;
    private final Path file;

    /** @param yaml the campaign file's nodes and problem list; never null */
    CalibrationReader(YamlNodes yaml) {
        this.yaml = yaml;
        this.file = yaml.file();
    }

    /** Reads the calibration section; null when it has errors (already reported). */
    TemperatureCalibration calibration(Node n) {
        if (!(n instanceof MappingNode)) {
            yaml.error(n, "temperature_calibration expects a mapping {points: [...], fit_offset: true|false}");
            return null;
        }
        Map<String, NodeTuple> m = yaml.entries((MappingNode) n, SECTION_KEYS, "temperature_calibration key");
        boolean ok = true;
        boolean fitOffset = false;
        NodeTuple fo = m.get("fit_offset");
        if (fo != null) {
            String s = yaml.scalar(fo.getValueNode(), "fit_offset");
            if ("true".equals(s) || "false".equals(s)) {
                fitOffset = Boolean.parseBoolean(s);
            } else {
                if (s != null) {
                    yaml.error(fo.getValueNode(), "fit_offset must be true or false, found '" + s + "'");
                }
                ok = false;
            }
        }
        NodeTuple pt = m.get("points");
        List<CalibrationPoint> points = new ArrayList<>();
        if (pt == null) {
            yaml.error(n, "temperature_calibration needs points: a list of observed reference events, each with"
                    + " event and reading (for example {event: gaas_oxide_desorption, reading: 562 degC})");
            return null;
        }
        if (!(pt.getValueNode() instanceof SequenceNode seq) || seq.getValue().isEmpty()) {
            yaml.error(pt.getValueNode(), "points must be a list of at least one {event: ..., reading: ...}");
            return null;
        }
        for (Node item : seq.getValue()) {
            CalibrationPoint p = point(item);
            if (p == null) {
                ok = false;
            } else {
                points.add(p);
            }
        }
        return ok ? new TemperatureCalibration(points, fitOffset, Double.NaN, pos(n)) : null;
    }

    private CalibrationPoint point(Node item) {
        if (!(item instanceof MappingNode)) {
            yaml.error(item, "a calibration point is a mapping {event: ..., reading: ...}");
            return null;
        }
        Map<String, NodeTuple> m = yaml.entries((MappingNode) item, POINT_KEYS, "calibration point key");
        NodeTuple et = m.get("event");
        if (et == null) {
            yaml.error(item, "calibration point needs event: one of " + String.join(", ", ReferenceEvent.keys())
                    + " or a name of your own (then with true, uncertainty and source)");
            return null;
        }
        String event = yaml.scalar(et.getValueNode(), "event");
        if (event == null) {
            return null;
        }
        if (!EVENT.matcher(event).matches()) {
            yaml.error(et.getValueNode(), "event '" + event + "' must be a name: a letter, then letters, digits, '_' or '-'");
            return null;
        }
        var builtIn = ReferenceEvent.byKey(event);
        NodeTuple rt = m.get("reading");
        if (rt == null) {
            yaml.error(item, "calibration point '" + event + "' needs reading: the temperature the thermocouple or"
                    + " pyrometer showed (for example 562 degC)");
            return null;
        }
        Double reading = temperature(rt.getValueNode(), "reading");
        Double readingU = m.containsKey("reading_uncertainty")
                ? difference(m.get("reading_uncertainty").getValueNode(), "reading_uncertainty")
                : Double.valueOf(TemperatureCalibration.DEFAULT_READING_UNCERTAINTY_K);
        if (builtIn.isPresent()) {
            for (String k : List.of("true", "uncertainty", "source")) {
                if (m.containsKey(k)) {
                    ReferenceEvent e = builtIn.get();
                    yaml.error(m.get(k).getKeyNode(), "'" + k + "' is built in for " + e.key() + " ("
                            + String.format(Locale.ROOT, "%.4f", e.trueKelvin() - Units.KELVIN_OFFSET).replaceAll("0+$", "")
                            + " degC, " + e.source() + "); remove it, or give the event a name of your own");
                    return null;
                }
            }
            if (reading == null || readingU == null) {
                return null;
            }
            return CalibrationPoint.of(builtIn.get(), reading, readingU, pos(item));
        }
        List<String> missing = new ArrayList<>();
        for (String k : List.of("true", "uncertainty", "source")) {
            if (!m.containsKey(k)) {
                missing.add(k);
            }
        }
        if (!missing.isEmpty()) {
            String hint = DidYouMean.suggest(event, ReferenceEvent.keys())
                    .map(s -> " (did you mean the built-in '" + s + "'?)").orElse("");
            yaml.error(et.getValueNode(), "'" + event + "' is not a built-in event (" + String.join(", ", ReferenceEvent.keys())
                    + ")" + hint + "; a custom event needs " + String.join(", ", missing)
                    + " (the accepted true temperature, its standard uncertainty and where it comes from)");
            return null;
        }
        Double trueK = temperature(m.get("true").getValueNode(), "true");
        Double trueU = difference(m.get("uncertainty").getValueNode(), "uncertainty");
        String source = yaml.scalar(m.get("source").getValueNode(), "source");
        if (source != null && source.isBlank()) {
            yaml.error(m.get("source").getValueNode(), "source must say where the true value comes from");
            source = null;
        }
        if (reading == null || readingU == null || trueK == null || trueU == null || source == null) {
            return null;
        }
        return new CalibrationPoint(event, false, reading, readingU, trueK, trueU, source.strip(), pos(item));
    }

    /** A temperature with its unit, in kelvin; null when bad (reported). */
    private Double temperature(Node n, String key) {
        String s = yaml.scalar(n, key);
        if (s == null) {
            return null;
        }
        Matcher mt = QUANTITY.matcher(s);
        if (!mt.matches()) {
            yaml.error(n, key + " must be a temperature with its unit, such as 562 degC or 835 K; found '" + s + "'");
            return null;
        }
        var u = Units.bySymbol(mt.group(2)).filter(x -> x.quantity() == dev.terrace.spi.Quantity.TEMPERATURE);
        if (u.isEmpty()) {
            yaml.error(n, key + ": unit '" + mt.group(2) + "' is not a temperature unit; expected degC or K");
            return null;
        }
        double k = u.get().toCanonical(Double.parseDouble(mt.group(1)), 1);
        if (!(k > 0) || !Double.isFinite(k)) {
            yaml.error(n, key + " " + s + " is not physical (at or below 0 K)");
            return null;
        }
        return k;
    }

    /** A temperature difference (an uncertainty) in K or degC, in kelvin; null when bad (reported). */
    private Double difference(Node n, String key) {
        String s = yaml.scalar(n, key);
        if (s == null) {
            return null;
        }
        Matcher mt = QUANTITY.matcher(s);
        if (!mt.matches() || !(mt.group(2).equals("K") || mt.group(2).equals("degC"))) {
            yaml.error(n, key + " must be a temperature difference with its unit, such as 3 K; found '" + s + "'");
            return null;
        }
        double v = Double.parseDouble(mt.group(1));
        if (!(v >= 0) || !Double.isFinite(v)) {
            yaml.error(n, key + " must not be negative, found '" + s + "'");
            return null;
        }
        return v;
    }

    /**
     * Reads {@code priors:}: a list of earlier campaign files, resolved against this campaign's folder.
     * A missing file or this campaign itself is an error at the entry; cycles through other files are
     * found when the priors are loaded.
     */
    List<PriorSource> priors(Node n) {
        List<PriorSource> out = new ArrayList<>();
        if (!(n instanceof SequenceNode)) {
            yaml.error(n, "priors must be a list of earlier campaign files, such as [../spring-series/campaign.yaml]");
            return out;
        }
        Path dir = file.toAbsolutePath().getParent();
        Set<Path> seen = new LinkedHashSet<>();
        for (Node item : ((SequenceNode) n).getValue()) {
            String s = yaml.scalar(item, "a priors entry");
            if (s == null) {
                continue;
            }
            if (s.isBlank()) {
                yaml.error(item, "priors holds an empty entry; expected the path of an earlier campaign file");
                continue;
            }
            Path p;
            try {
                p = (dir == null ? Path.of(s.strip()) : dir.resolve(s.strip())).normalize();
            } catch (java.nio.file.InvalidPathException e) {
                yaml.error(item, "'" + s + "' is not a usable file path: " + e.getReason());
                continue;
            }
            if (p.equals(file.toAbsolutePath().normalize())) {
                yaml.error(item, "priors names this campaign file itself; a campaign cannot be its own prior");
                continue;
            }
            if (!seen.add(p)) {
                yaml.error(item, "'" + s + "' appears twice in priors");
                continue;
            }
            if (!Files.isRegularFile(p)) {
                yaml.error(item, "prior campaign file not found: " + p);
                continue;
            }
            out.add(new PriorSource(p, s.strip(), pos(item)));
        }
        return out;
    }
}
