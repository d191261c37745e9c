package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Two fits of the same invented campaign print the same text, discrete choices in declaration order. */
class FitOutputOrderTest {

    @Test
    void twoFitsPrintIdenticalTextWithChoicesInDeclarationOrder(@TempDir Path tmp) throws Exception {
        Path campaign = FitRunStatusTest.campaign(tmp.resolve("c"));
        CliTest.Outcome first = run("fit", campaign.toString(), "--quiet");
        CliTest.Outcome second = run("fit", campaign.toString(), "--quiet");
        assertEquals(0, first.code(), first.err());
        assertEquals(first.out(), second.out());
        // island-nucleation declares critical_size before island_dimension (IslandNucleationModel.parameters())
        List<String> choiceLines = first.out().lines().filter(l -> l.contains("critical_size ") && l.contains("island_dimension ")).toList();
        assertEquals(6, choiceLines.size(), first.out());
        for (String l : choiceLines) {
            assertTrue(l.matches("\\s+>?\\s*critical_size \\d, island_dimension \\d\\s+\\S+"), l);
        }
    }
}
