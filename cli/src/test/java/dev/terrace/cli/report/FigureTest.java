package dev.terrace.cli.report;

import org.jfree.svg.SVGGraphics2D;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;

import java.awt.Color;
import java.awt.geom.Rectangle2D;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Inlines SVG drawn by JFreeSVG (the library the report's charts use) and checks ids, scaling and guards. */
class FigureTest {

    /** A drawing with a clip path, as JFreeSVG writes it. */
    static String clippedDrawing() {
        SVGGraphics2D g = new SVGGraphics2D(200, 100);
        g.setClip(new Rectangle2D.Double(10, 10, 150, 80));
        g.setColor(Color.BLACK);
        g.fill(new Rectangle2D.Double(0, 0, 200, 100));
        return g.getSVGDocument();
    }

    @Test
    void twoDrawingsInOnePageKeepTheirIdsApartAndTheirReferencesWorking() {
        Figure a = Figure.of("first", "a", clippedDrawing());
        Figure b = Figure.of("second", "b", clippedDrawing());
        Document d = Jsoup.parse("<div>" + a.svg() + b.svg() + "</div>");
        Set<String> ids = new HashSet<>();
        List<String> all = d.select("[id]").eachAttr("id");
        assertFalse(all.isEmpty(), "JFreeSVG writes clip paths with ids");
        for (String id : all) {
            assertTrue(ids.add(id), "duplicate id " + id);
            assertTrue(id.startsWith("first-") || id.startsWith("second-"), id);
        }
        for (Element e : d.select("[clip-path]")) {
            String ref = e.attr("clip-path").replaceAll("url\\(['\"]?#([^'\")]+)['\"]?\\)", "$1");
            assertTrue(ids.contains(ref), "reference to a missing id: " + e.attr("clip-path"));
        }
    }

    @Test
    void theDrawingGetsAViewBoxAndLosesItsProlog() {
        Figure f = Figure.of("k", "c", "<?xml version=\"1.0\"?>\n<!-- drawn -->\n" + clippedDrawing());
        assertTrue(f.svg().startsWith("<svg"));
        Element svg = Jsoup.parse(f.svg()).selectFirst("svg");
        assertEquals("0 0 200 100", svg.attr("viewBox").replace(".0", ""));
    }

    @Test
    void aDrawingWithUndefinedNumbersIsRefused() {
        assertThrows(IllegalArgumentException.class,
                () -> Figure.of("k", "c", "<svg width='10' height='10'><rect x='NaN' y='0'/></svg>"));
        assertThrows(IllegalArgumentException.class, () -> Figure.of("k", "c", "<p>no drawing</p>"));
        assertThrows(IllegalArgumentException.class, () -> Figure.of("1bad", "c", clippedDrawing()));
    }

    @Test
    void theSameDrawingAlwaysGivesTheSameText() {
        assertEquals(Figure.of("k", "c", clippedDrawing()).svg(), Figure.of("k", "c", clippedDrawing()).svg(),
                "ids are renamed by position, not kept from the drawing library's clock-based prefix");
    }
}
