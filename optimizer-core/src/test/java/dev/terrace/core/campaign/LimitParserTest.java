package dev.terrace.core.campaign;

import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class LimitParserTest {

    static LinearLimit parse(String s) throws LimitParser.LimitSyntaxException {
        return LimitParser.parse(s, SourcePosition.UNKNOWN);
    }

    @Test
    void bringsBothSidesToSlackForm() throws Exception {
        LinearLimit l = parse("anneal_temp >= substrate_temp + 20");
        assertEquals(Map.of("anneal_temp", 1.0, "substrate_temp", -1.0), l.coefficients());
        assertEquals(-20.0, l.constant());
        assertEquals(5.0, l.slack(Map.of("anneal_temp", 325.0, "substrate_temp", 300.0)));
    }

    @Test
    void handlesCoefficientsOnEitherSideAndLessThan() throws Exception {
        LinearLimit l = parse("2*a - b*0.5 + 1e1 <= 3 * a");
        // 3a - (2a - 0.5b + 10) >= 0  ->  a + 0.5b - 10 >= 0
        assertEquals(1.0, l.coefficients().get("a"), 1e-12);
        assertEquals(0.5, l.coefficients().get("b"), 1e-12);
        assertEquals(-10.0, l.constant(), 1e-12);
        assertTrue(l.holds(Map.of("a", 10.0, "b", 0.0)));
    }

    @Test
    void rejectsNonLinearOrIncompleteText() {
        assertThrows(LimitParser.LimitSyntaxException.class, () -> parse("a * b >= 1"));
        assertThrows(LimitParser.LimitSyntaxException.class, () -> parse("a = 1"));
        assertThrows(LimitParser.LimitSyntaxException.class, () -> parse("a >= "));
        assertThrows(LimitParser.LimitSyntaxException.class, () -> parse("a >= a"));
        LimitParser.LimitSyntaxException e =
                assertThrows(LimitParser.LimitSyntaxException.class, () -> parse("a >= 1 )"));
        assertEquals(7, e.offset);
    }
}
