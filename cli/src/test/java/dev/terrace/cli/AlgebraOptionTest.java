package dev.terrace.cli;

import dev.terrace.core.linalg.Algebra;
import org.junit.jupiter.api.Test;

import java.io.PrintWriter;
import java.io.StringWriter;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The linear-algebra backend is named by --version and a misspelt request is a usage error. */
class AlgebraOptionTest {

    @Test
    void versionNamesTheBackend() {
        StringWriter out = new StringWriter();
        int rc = Main.execute(new PrintWriter(out, true), new PrintWriter(new StringWriter(), true), "--version");
        assertEquals(0, rc);
        assertTrue(out.toString().contains("linear algebra: " + Algebra.current().name()), out.toString());
    }

    @Test
    void anUnknownBackendIsRefusedWithExitCode2() {
        String before = System.getProperty(Algebra.PROPERTY);
        System.setProperty(Algebra.PROPERTY, "quantum");
        try {
            StringWriter err = new StringWriter();
            int rc = Main.execute(new PrintWriter(new StringWriter(), true), new PrintWriter(err, true), "--version");
            assertEquals(2, rc);
            assertTrue(err.toString().contains("'quantum'") && err.toString().contains("auto, native or java"),
                    err.toString());
        } finally {
            if (before == null) {
                System.clearProperty(Algebra.PROPERTY);
            } else {
                System.setProperty(Algebra.PROPERTY, before);
            }
        }
    }
}
