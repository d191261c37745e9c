package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.io.InputFiles;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The YAML node tree of one campaign file, read with every problem added once to a shared list with
 * its line and column: composing the tree under the loader's limits, and typed access to mappings,
 * scalars, lists and numbers. {@link CampaignReader}, {@link CalibrationReader} and
 * {@link CampaignLimits} read their sections through one instance, so their messages share a form.
 */
final class YamlNodes {

    private final Path file;
    private final List<Diagnostic> problems;

    /**
     * @param file     the file the diagnostics name; never null
     * @param problems where problems are added; never null
     */
    YamlNodes(Path file, List<Diagnostic> problems) {
        this.file = file;
        this.problems = problems;
    }

    /** @return the file the diagnostics name */
    Path file() {
        return file;
    }

    /** @return the shared list of problems (mutable) */
    List<Diagnostic> problems() {
        return problems;
    }

    /**
     * Composes the node tree of a campaign text: duplicate keys are let through (the readers report
     * them with both positions), at most 10 aliases to collections, at most
     * {@link InputFiles#MAX_CAMPAIGN_BYTES} code points.
     *
     * @param text the whole text
     * @return the root node, or null for an empty text or when the text is not valid YAML (reported)
     */
    Node compose(String text) {
        LoaderOptions opts = new LoaderOptions();
        opts.setAllowDuplicateKeys(true); // duplicates are reported by us, with both positions
        opts.setMaxAliasesForCollections(10);
        // the same bound as the file size, so text handed to parse() directly is bounded too
        opts.setCodePointLimit((int) InputFiles.MAX_CAMPAIGN_BYTES);
        try {
            return new Yaml(opts).compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            String what = e.getProblem() != null ? e.getProblem() : e.getMessage();
            int[] at = m != null ? new int[] {m.getLine() + 1, m.getColumn() + 1} : YamlErrorPosition.of(text, e, opts);
            error(at[0], at[1], "not valid YAML: " + what);
            return null;
        } catch (YAMLException e) {
            // a disallowed character, or a loader limit (nesting depth, aliases): the library gives
            // no line, so find it
            int[] at = YamlErrorPosition.of(text, e, opts);
            String what = e instanceof org.yaml.snakeyaml.reader.ReaderException re
                    ? String.format("character U+%04X is not allowed in YAML text (control characters and"
                    + " non-characters must be removed)", re.getCodePoint())
                    : e.getMessage();
            error(at[0], at[1], "not valid YAML: " + what);
            return null;
        }
    }

    /**
     * Entries of a mapping by key text; reports non-scalar keys, duplicates and (if allowed != null)
     * unknown keys, and leaves those out.
     */
    Map<String, NodeTuple> entries(MappingNode m, Collection<String> allowed, String what) {
        Map<String, NodeTuple> out = new LinkedHashMap<>();
        for (NodeTuple t : m.getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode)) {
                error(t.getKeyNode(), what + " must be a plain name");
                continue;
            }
            String k = ((ScalarNode) t.getKeyNode()).getValue();
            if (out.containsKey(k)) {
                error(t.getKeyNode(), "duplicate " + what + " '" + k + "' (first at line "
                        + (out.get(k).getKeyNode().getStartMark().getLine() + 1) + ")");
                continue;
            }
            if (allowed != null && !allowed.contains(k)) {
                error(t.getKeyNode(), "unknown " + what + " '" + k + "'; expected one of " + String.join(", ", allowed)
                        + hint(k, allowed));
                continue;
            }
            out.put(k, t);
        }
        return out;
    }

    /** The text of a scalar; null (reported) for a list or mapping. */
    String scalar(Node n, String what) {
        if (!(n instanceof ScalarNode)) {
            error(n, what + " must be a single value, not a " + (n instanceof SequenceNode ? "list" : "mapping"));
            return null;
        }
        return ((ScalarNode) n).getValue();
    }

    /** The text of a mapping's scalar entry; null when absent (reported when required) or not a scalar. */
    String scalarText(Map<String, NodeTuple> m, String key, Node parent, boolean required) {
        NodeTuple t = m.get(key);
        if (t == null) {
            if (required) {
                error(parent, "missing key '" + key + "'");
            }
            return null;
        }
        return scalar(t.getValueNode(), key);
    }

    /**
     * A list of distinct, non-blank scalars; entries that are not are reported and left out
     * (repeats are kept for {@code models}, whose reader names them itself).
     */
    List<String> stringList(Node n, String what) {
        List<String> out = new ArrayList<>();
        if (!(n instanceof SequenceNode)) {
            error(n, what + " must be a list such as [a, b]");
            return out;
        }
        Set<String> seen = new LinkedHashSet<>();
        for (Node item : ((SequenceNode) n).getValue()) {
            String s = scalar(item, what);
            if (s == null) {
                continue;
            }
            if (s.isBlank()) {
                error(item, what + " holds an empty entry");
                continue;
            }
            if (!what.equals("models") && !seen.add(s)) {
                error(item, "'" + s + "' appears twice in " + what);
                continue;
            }
            out.add(s);
        }
        return out;
    }

    /** A finite number under {@code key}; null (reported) when missing, not a number or not finite. */
    Double number(Map<String, NodeTuple> m, String key, Node parent, String owner) {
        NodeTuple t = m.get(key);
        if (t == null) {
            error(parent, "'" + owner + "' needs " + key);
            return null;
        }
        String s = scalar(t.getValueNode(), key);
        if (s == null) {
            return null;
        }
        try {
            double v = Double.parseDouble(s.trim());
            if (!Double.isFinite(v)) {
                error(t.getValueNode(), key + " must be a finite number, found '" + s + "'");
                return null;
            }
            return v;
        } catch (NumberFormatException e) {
            error(t.getValueNode(), key + " must be a number, found '" + s + "'"
                    + (s.contains(",") ? " (use a decimal point)" : ""));
            return null;
        }
    }

    /** @return {@code " (did you mean 'x'?)"} for a near miss, else empty */
    static String hint(String given, Collection<String> known) {
        return DidYouMean.suggest(given, known).map(s -> " (did you mean '" + s + "'?)").orElse("");
    }

    /** @return a bound as the file would write it: whole numbers without ".0" */
    static String fmt(double v) {
        return (v == Math.rint(v) && Math.abs(v) < 1e15) ? String.valueOf((long) v) : String.valueOf(v);
    }

    /** @return the node's 1-based start position */
    static SourcePosition pos(Node n) {
        return new SourcePosition(n.getStartMark().getLine() + 1, n.getStartMark().getColumn() + 1);
    }

    void error(Node n, String message) {
        error(n.getStartMark().getLine() + 1, n.getStartMark().getColumn() + 1, message);
    }

    void error(SourcePosition p, String message) {
        error(p.line(), p.column(), message);
    }

    void error(int line, int column, String message) {
        problems.add(Diagnostic.error(file, line, column, message));
    }
}
