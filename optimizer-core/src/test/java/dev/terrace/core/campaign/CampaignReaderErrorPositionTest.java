package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Regressions found by {@code ReaderFuzzTest}: YAML errors that the YAML library reports without a
 * line (a disallowed character, too deep nesting, too many aliases to collections) must still name
 * the line and column in the campaign file.
 */
class CampaignReaderErrorPositionTest {

    private static final Path FILE = Path.of("campaign.yaml");

    private static Diagnostic onlyError(String yaml) {
        InputException e = assertThrows(InputException.class,
                () -> CampaignReader.parse(FILE, new StringReader(yaml), null));
        List<Diagnostic> errors = e.diagnostics().stream().filter(Diagnostic::isError).toList();
        assertEquals(1, errors.size(), errors.toString());
        return errors.get(0);
    }

    @Test
    void aControlCharacterIsReportedAtItsLineAndColumn() {
        // BEL (U+0007) at line 3, column 10 (after "title: ab"); a double-width code point before it
        // on line 2 counts as one column.
        Diagnostic d = onlyError("campaign: t1\n# \uD83D\uDE00 comment\ntitle: ab\u0007cd\n");
        assertEquals(3, d.line(), d.toString());
        assertEquals(10, d.column(), d.toString());
        assertTrue(d.message().contains("U+0007"), d.message());
    }

    @Test
    void tooDeepNestingIsReportedWhereTheLimitIsCrossed() {
        // 60 nested flow sequences on line 2; the loader's default depth limit is 50 collections.
        Diagnostic d = onlyError("campaign: t1\ntitle: " + "[".repeat(60) + "]".repeat(60) + "\n");
        assertEquals(2, d.line(), d.toString());
        assertTrue(d.column() > 7 && d.column() <= 7 + 60, d.toString());
        assertTrue(d.message().contains("Nesting Depth"), d.message());
    }

    @Test
    void anAliasExpansionBombIsReportedAtTheAliasOverTheLimit() {
        // The campaign reader allows 10 aliases to collections; the 11th (line 3) is refused.
        String yaml = "a: &a [x, x]\nb: [*a, *a, *a, *a, *a, *a, *a, *a, *a, *a]\nc: [*a]\n";
        Diagnostic d = onlyError(yaml);
        assertEquals(3, d.line(), d.toString());
        assertEquals(5, d.column(), d.toString());
    }
}
