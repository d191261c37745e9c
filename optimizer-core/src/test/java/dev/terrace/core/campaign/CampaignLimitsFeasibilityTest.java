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
 * The feasibility check of {@code limits:} against the parameter boxes. Check values are worked by
 * hand: over the box [0, 1] x [0, 1] the largest value of x + y is 2, so x + y >= 2 holds only at
 * the corner (1, 1) and x + y >= 2.5 nowhere; x >= y + 0.5 and y >= x + 0.5 hold alone but never
 * together (adding them gives 0 >= 1).
 */
class CampaignLimitsFeasibilityTest {

    private static final Path FILE = Path.of("/lab/series/campaign.yaml");

    private static String campaign(int extraParameters, String... limits) {
        StringBuilder sb = new StringBuilder(String.join("\n",
                "campaign: scale-check",
                "material: {substrate: GaAs}",
                "parameters:",
                "  x: {unit: ML, min: 0, max: 1, role: coverage}",
                "  y: {unit: ML, min: 0, max: 1}",
                ""));
        for (int i = 0; i < extraParameters; i++) {
            sb.append("  p").append(i).append(": {unit: s, min: 0, max: 10}\n");
        }
        sb.append("outcomes:\n  mode: {classes: [step-flow, islands], role: growth_mode}\nlimits:\n");
        for (String l : limits) {
            sb.append("  - ").append(l).append('\n');
        }
        return sb.toString();
    }

    private static Campaign parse(String yaml) throws InputException {
        return CampaignReader.parse(FILE, new StringReader(yaml), null).campaign();
    }

    private static List<Diagnostic> errors(String yaml) {
        return assertThrows(InputException.class, () -> parse(yaml)).diagnostics();
    }

    @Test
    void aLimitReachedOnlyAtACornerIsFeasible() throws Exception {
        assertEquals(1, parse(campaign(0, "x + y >= 2")).limits().size());
    }

    @Test
    void aLimitBeyondTheBoxIsReported() {
        List<Diagnostic> ds = errors(campaign(0, "x + y >= 2.5"));
        assertEquals(1, ds.size(), ds.toString());
        assertTrue(ds.get(0).message().contains("no setting inside the parameter boxes"), ds.get(0).message());
    }

    @Test
    void limitsThatHoldAloneButNotTogetherAreReported() {
        List<Diagnostic> ds = errors(campaign(0, "x >= y + 0.5", "y >= x + 0.5"));
        assertEquals(1, ds.size(), ds.toString());
        assertTrue(ds.get(0).message().contains("cannot all hold at once"), ds.get(0).message());
    }

    @Test
    void twentyThousandParametersWithLimitsAreCheckedInSizeOfTheLimitsNotOfTheSquare() throws Exception {
        // before, the programme held two dense rows of 20 002 numbers per parameter: about 6 GB
        Campaign c = parse(campaign(20_000, "x + y >= 2", "p19999 >= x + 9"));
        assertEquals(20_002, c.parameters().size());
        List<Diagnostic> ds = errors(campaign(20_000, "x + y >= 2", "p19999 >= x + 9", "p19999 <= 9.5"));
        assertEquals(1, ds.size(), ds.toString());
        assertTrue(ds.get(0).message().contains("cannot all hold at once"), ds.get(0).message());
    }
}
