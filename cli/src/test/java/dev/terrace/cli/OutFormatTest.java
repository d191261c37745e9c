package dev.terrace.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code propose --out FILE} and {@code rank --out FILE} pick the format from the file's extension
 * unless {@code --format} is given; the written text is read back with Jackson (JSON) and checked
 * for the CSV header the README documents.
 */
class OutFormatTest {

    @TempDir
    static Path tmp;

    static Path campaign;

    @BeforeAll
    static void copyTheDemo() throws Exception {
        campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
    }

    static String propose(Path out, String... more) throws Exception {
        String[] base = {"propose", campaign.toString(), "--batch", "1", "--no-journal", "--quiet", "--out", out.toString()};
        String[] args = java.util.Arrays.copyOf(base, base.length + more.length);
        System.arraycopy(more, 0, args, base.length, more.length);
        CliTest.Outcome o = run(args);
        assertEquals(0, o.code(), o.err());
        return o.err();
    }

    @Test
    void csvJsonAndTxtExtensionsPickTheFormat() throws Exception {
        Path csv = tmp.resolve("next.csv");
        propose(csv);
        assertTrue(Files.readString(csv).contains("\nrank,id,yield,"), Files.readString(csv));
        Path json = tmp.resolve("next.JSON");
        propose(json);
        assertEquals("ga-dots-demo", new ObjectMapper().readTree(Files.readString(json)).get("campaign").asText());
        Path txt = tmp.resolve("next.txt");
        propose(txt);
        String table = Files.readString(txt);
        assertFalse(table.startsWith("{") || table.contains("rank,id,"), table);
        assertTrue(table.contains("P-"), table);
    }

    @Test
    void anExplicitFormatWinsOverTheExtension() throws Exception {
        Path out = tmp.resolve("explicit.csv");
        propose(out, "--format", "json");
        assertTrue(Files.readString(out).startsWith("{"), Files.readString(out));
    }

    @Test
    void anUnknownExtensionKeepsTheTableAndSaysSo() throws Exception {
        Path out = tmp.resolve("next.dat");
        String err = propose(out);
        assertTrue(err.contains("does not end in .csv, .json or .txt"), err);
        assertTrue(Files.readString(out).startsWith("Proposals ("), Files.readString(out));
    }

    @Test
    void rankPicksTheFormatFromTheExtensionToo() throws Exception {
        Path cands = tmp.resolve("cands.csv");
        Files.writeString(cands, "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\n"
                + "C1,250,4,0.1,2e-6,250,As4\n");
        Path out = tmp.resolve("ranked.json");
        CliTest.Outcome o = run("rank", campaign.toString(), "--candidates", cands.toString(), "--quiet",
                "--out", out.toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(1, new ObjectMapper().readTree(Files.readString(out)).get("proposals").size());
    }
}
