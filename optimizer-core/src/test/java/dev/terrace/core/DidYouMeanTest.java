package dev.terrace.core;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Tests of {@link DidYouMean}. */
class DidYouMeanTest {

    private static final List<String> COLUMNS = List.of("run_id", "t_sub", "in_rate", "as_bep", "as_species",
            "density", "status", "notes");

    @Test
    void distanceMatchesTheTextbookLevenshteinExamples() {
        // kitten -> sitting = 3 and flaw -> lawn = 2: the standard worked examples of the Levenshtein
        // distance (V. I. Levenshtein, Soviet Physics Doklady 10, 707 (1966); examples as given in
        // the Wikipedia article "Levenshtein distance").
        assertEquals(3, DidYouMean.distance("kitten", "sitting"));
        assertEquals(2, DidYouMean.distance("flaw", "lawn"));
        assertEquals(0, DidYouMean.distance("", ""));
        assertEquals(4, DidYouMean.distance("", "abcd"));
    }

    @Test
    void adjacentSwapCountsOnceButNoSubstringIsEditedTwice() {
        // Optimal string alignment: CA -> ABC is 3, whereas the unrestricted Damerau-Levenshtein
        // distance is 2 (worked example in the Wikipedia article "Damerau-Levenshtein distance").
        assertEquals(1, DidYouMean.distance("ab", "ba"));
        assertEquals(3, DidYouMean.distance("ca", "abc"));
        assertEquals(1, DidYouMean.distance("in_rtae", "in_rate"));
    }

    @Test
    void distanceCountsCodePointsNotChars() {
        // U+1F600 is one code point but two UTF-16 chars; swapping it for "x" is one substitution.
        assertEquals(1, DidYouMean.distance("a\uD83D\uDE00", "ax"));
    }

    @Test
    void suggestsTheNearestKnownNameWithinTwoEdits() {
        assertEquals(Optional.of("in_rate"), DidYouMean.suggest("in_rat", COLUMNS));
        assertEquals(Optional.of("in_rate"), DidYouMean.suggest("in_rtae", COLUMNS));
        assertEquals(Optional.of("as_species"), DidYouMean.suggest("as_specie", COLUMNS));
        assertEquals(Optional.of("t_sub"), DidYouMean.suggest("tsub", COLUMNS));
        assertEquals(Optional.of("density"), DidYouMean.suggest("densty_", COLUMNS));
    }

    @Test
    void comparesWithoutRegardToCaseAndReturnsTheKnownSpelling() {
        assertEquals(Optional.of("As4"), DidYouMean.suggest("as4", List.of("As2", "As4")));
        assertEquals(Optional.of("run_id"), DidYouMean.suggest("RUN_ID", COLUMNS));
    }

    @Test
    void suggestsNothingWhenEveryNameIsFarther() {
        assertEquals(Optional.empty(), DidYouMean.suggest("wafer_lot", COLUMNS));
        assertEquals(Optional.empty(), DidYouMean.suggest("in_amount", COLUMNS));
        assertEquals(Optional.empty(), DidYouMean.suggest("x", List.of()));
        assertEquals(Optional.empty(), DidYouMean.suggest("  ", COLUMNS));
    }

    @Test
    void shortNamesAreSuggestedOnlyAtOneEdit() {
        assertEquals(Optional.of("dot"), DidYouMean.suggest("dit", List.of("dot", "ring")));
        assertEquals(Optional.empty(), DidYouMean.suggest("dxx", List.of("dot", "ring")),
                "two edits in three letters is too far");
    }

    @Test
    void tiesGoToTheNameMetFirst() {
        assertEquals(Optional.of("As2"), DidYouMean.suggest("As3", List.of("As2", "As4")));
        assertEquals(Optional.of("As4"), DidYouMean.suggest("As3", List.of("As4", "As2")));
    }
}
