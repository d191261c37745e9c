package dev.terrace.cli;

import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The progress bar draws through the progressbar library only when asked and when it can be seen. */
class ProgressTest {

    @Test
    void quietSilencesTheBar() {
        GlobalOptions g = new GlobalOptions();
        g.quiet = true;
        try (Progress p = Progress.start("fitting", 3, g)) {
            assertFalse(p.visible());
            p.step().message("x").stepTo(3);
        }
    }

    @Test
    void aRedirectedStandardErrorSilencesTheBar() {
        // the test JVM's standard streams are pipes to the build tool, not a terminal
        assertFalse(Progress.stderrIsTerminal());
        try (Progress p = Progress.start("fitting", 3, new GlobalOptions())) {
            assertFalse(p.visible());
            assertSame(Progress.none(), p);
        }
    }

    @Test
    void aVisibleBarShowsTheTaskAndTheStepsDone() {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream sink = new PrintStream(buf, true, StandardCharsets.UTF_8);
        try (Progress p = Progress.drawingTo(sink, "mapping", 4)) {
            assertTrue(p.visible());
            Runnable tick = p.ticker();
            for (int i = 0; i < 4; i++) {
                tick.run();
            }
            p.message("grid done");
        }
        String text = buf.toString(StandardCharsets.UTF_8);
        assertTrue(text.contains("mapping"), text);
        assertTrue(text.contains("4/4"), text);
        assertEquals('\n', text.charAt(text.length() - 1), "closing ends the bar's line");
    }

    @Test
    void negativeStepCountsAreRefused() {
        assertThrows(IllegalArgumentException.class,
                () -> Progress.drawingTo(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8),
                        "x", -1));
    }
}
