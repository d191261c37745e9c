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

    static final List<String> TRICKY = List.of("<script>alert('x')</script>", "a & b < c > d", "\"quoted\" 'single'",
            "&amp; stays literal", "</td></tr></table><p>", "x\u0007y", "degC \u00b0C cm^-2");

    @Test
    void escapedTextReadsBackAsTheSameTextInElementsAndAttributes() {
        for (String s : TRICKY) {
            Document d = Jsoup.parse("<p title=\"" + Html.escape(s) + "\">" + Html.escape(s) + "</p>");
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
        assertEquals("2.32e10", Html.num(2.32e10));
        assertEquals("0.9114", Html.num(0.91138));
        assertEquals("39.38", Html.num(39.3812));
        assertEquals("-1.241", Html.num(-1.2409));
        assertEquals("3.2e-6", Html.setting(3.2e-6));
        assertEquals("0.0248", Html.setting(0.0248));
        assertEquals("250", Html.setting(250.0));
        assertEquals("42\u00a0%", Html.percent(0.4249));
    }

    @Test
    void powersOfTenAndUnitPowersBecomeSuperscripts() {
        Document d = Jsoup.parse(Html.create().number("2.32e10").text(" ").unit("cm^-2").toString());
        assertEquals("2.32 \u00d7 1010 cm\u22122", d.body().text().replace('\u00a0', ' '));
        assertEquals(List.of("10", "\u22122"), d.select("sup").eachText());
        Document one = Jsoup.parse(Html.create().number("1e-4").toString());
        assertEquals("10\u22124", one.body().text(), "a mantissa of 1 is left out");
        assertFalse(Html.create().unit("degC").toString().contains("degC"), "degC is written as \u00b0C");
    }
}
