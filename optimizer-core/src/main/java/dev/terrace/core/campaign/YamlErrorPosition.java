package dev.terrace.core.campaign;

import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.events.AliasEvent;
import org.yaml.snakeyaml.events.CollectionEndEvent;
import org.yaml.snakeyaml.events.CollectionStartEvent;
import org.yaml.snakeyaml.events.Event;
import org.yaml.snakeyaml.reader.ReaderException;

import java.io.StringReader;
import java.util.HashSet;
import java.util.Set;

/**
 * Finds the line and column of a YAML error that the YAML library reports without a position: a
 * character YAML does not allow (the library gives only its index in the text), and the loader's
 * limits on nesting depth and on aliases to collections (the library gives no position at all).
 */
final class YamlErrorPosition {

    private YamlErrorPosition() {
    }

    /**
     * @param text the whole campaign text that failed to load
     * @param e    the unpositioned error
     * @param opts the loader options the text was loaded with (for its limits)
     * @return {line, column}, both 1-based; {0, 0} only when no position can be found
     */
    static int[] of(String text, YAMLException e, LoaderOptions opts) {
        if (e instanceof ReaderException re) {
            return atCodePoint(text, re.getPosition());
        }
        int depth = 0;
        int deepest = 0;
        int aliases = 0;
        Set<String> collectionAnchors = new HashSet<>();
        Mark last = null;
        Mark deepestMark = null;
        try {
            for (Event ev : new Yaml(opts).parse(new StringReader(text))) {
                last = ev.getStartMark();
                if (ev instanceof CollectionStartEvent cs) {
                    depth++;
                    if (cs.getAnchor() != null) {
                        collectionAnchors.add(cs.getAnchor());
                    }
                    if (depth > deepest) {
                        deepest = depth;
                        deepestMark = last;
                    }
                    if (depth > opts.getNestingDepthLimit()) {
                        return at(last);
                    }
                } else if (ev instanceof CollectionEndEvent) {
                    depth--;
                } else if (ev instanceof AliasEvent a && collectionAnchors.contains(a.getAnchor())
                        && ++aliases > opts.getMaxAliasesForCollections()) {
                    return at(last);
                }
            }
        } catch (YAMLException again) {
            // the text fails while parsing, too: the last event read is the nearest position
        }
        Mark m = deepestMark != null && deepest >= opts.getNestingDepthLimit() ? deepestMark : last;
        return m == null ? new int[] {0, 0} : at(m);
    }

    private static int[] at(Mark m) {
        return new int[] {m.getLine() + 1, m.getColumn() + 1};
    }

    /** Line and column (both 1-based, columns in code points) of the code point at {@code index}. */
    private static int[] atCodePoint(String text, int index) {
        int line = 1;
        int column = 1;
        int seen = 0;
        for (int k = 0; k < text.length() && seen < index; k += Character.charCount(text.codePointAt(k)), seen++) {
            char c = text.charAt(k);
            if (c == '\n' || (c == '\r' && (k + 1 >= text.length() || text.charAt(k + 1) != '\n'))) {
                line++;
                column = 1;
            } else if (c != '\r') {
                column++;
            }
        }
        return new int[] {line, column};
    }
}
