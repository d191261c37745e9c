package dev.terrace.cli.report;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks the HTML writer against jsoup, an HTML parser that follows the WHATWG HTML standard's
 * parsing rules: what the writer escapes must read back as the same text, with no elements made.
 */
class HtmlTest {

    // Test design choice: markup, entities, quotes, a control character (U+0007) and non-ASCII text.
    static final List<String> TRICKY = List.of("<script>alert('x')</script>", "a & b < c > d", "\"quoted\" 'single'",
            "&amp; stays literal", "</td></tr></table><p>", "x\u0007y", "degC \u00b0C cm^-2");

    @Test
    void escapedTextReadsBackAsTheSameTextInElementsAndAttributes() {
        for (String s : TRICKY) {
            Document d = Jsoup.parse("<p title=\"" + Html.escape(s) + "\">" + Html.escape(s) + "</p>");
            // derived here: Html.escape writes C0 control characters other than tab, LF and CR as a space
            // (the WHATWG HTML standard makes control characters in the input a parse error; from memory)
            String expected = s.replace('\u0007', ' ');
            assertEquals(expected, d.selectFirst("p").wholeText(), "element text of " + s);
            assertEquals(expected, d.selectFirst("p").attr("title"), "attribute of " + s);
            assertTrue(d.select("script, td, table").isEmpty(), "no element made from " + s);
        }
    }

    @Test
    void numbersNeverComeOutAsNaNOrInfinity() {
        for (double v : new double[] {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            assertEquals(Html.NO_VALUE, Html.num(v));
            assertEquals(Html.NO_VALUE, Html.setting(v));
            assertEquals(Html.NO_VALUE, Html.percent(v));
        }
    }

    @Test
    void numbersKeepFourSignificantDigitsAndSettingsRoundTrip() {
        // Inputs are test design choices; each expected text is derived here by hand from the documented
        // rules: num() rounds half-up to 4 significant digits, drops trailing zeros and uses a power of ten
        // outside [1e-3, 1e5); setting() writes the shortest round-trip decimal (Double.toString), with a
        // power of ten outside [1e-3, 1e6); percent() rounds 100 p to a whole number.
        assertEquals("2.32e10", Html.num(2.32e10), "derived here: 2.320e10, trailing zero dropped");
        assertEquals("0.9114", Html.num(0.91138), "derived here: 0.91138 to 4 significant digits");
        assertEquals("39.38", Html.num(39.3812), "derived here: 39.3812 to 4 significant digits");
        assertEquals("-1.241", Html.num(-1.2409), "derived here: -1.2409 to 4 significant digits");
        assertEquals("3.2e-6", Html.setting(3.2e-6), "derived here: below 1e-3, mantissa 3.2, exponent -6");
        assertEquals("0.0248", Html.setting(0.0248), "derived here: Double.toString gives 0.0248");
        assertEquals("250", Html.setting(250.0), "derived here: 250.0 with the trailing zero stripped");
        // derived here: 100 * 0.4249 = 42.49 rounds to 42; a space before % (SI Brochure, BIPM 2019; from memory),
        // a no-break space (U+00A0, Unicode Standard) so the sign stays with its number
        assertEquals("42\u00a0%", Html.percent(0.4249));
    }

    @Test
    void powersOfTenAndUnitPowersBecomeSuperscripts() {
        // Expected texts derived here from the writer's rules: "e" becomes U+00D7 MULTIPLICATION SIGN and
        // "10" with the exponent as a superscript, "-" in an exponent becomes U+2212 MINUS SIGN, "degC"
        // becomes U+00B0 DEGREE SIGN + "C" (code points from the Unicode Standard; the times sign and the
        // minus sign for numbers follow the SI Brochure, BIPM 2019, from memory). Inputs: test design choice.
        Document d = Jsoup.parse(Html.create().number("2.32e10").text(" ").unit("cm^-2").toString());
        assertEquals("2.32 \u00d7 1010 cm\u22122", d.body().text().replace('\u00a0', ' '));
        assertEquals(List.of("10", "\u22122"), d.select("sup").eachText());
        Document one = Jsoup.parse(Html.create().number("1e-4").toString());
        assertEquals("10\u22124", one.body().text(), "a mantissa of 1 is left out");
        assertFalse(Html.create().unit("degC").toString().contains("degC"), "degC is written as \u00b0C");
    }
}
