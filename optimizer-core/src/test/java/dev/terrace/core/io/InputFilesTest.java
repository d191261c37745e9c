package dev.terrace.core.io;

import dev.terrace.core.InputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class InputFilesTest {

    private static String message(InputException e) {
        return e.diagnostics().get(0).toString();
    }

    @Test
    void readsARegularFile(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("runs.csv"), "run_id\nR1\n");
        assertArrayEquals("run_id\nR1\n".getBytes(StandardCharsets.UTF_8), InputFiles.read(f, InputFiles.RUN_LOG));
    }

    @Test
    void aMissingFileIsLeftToTheCaller(@TempDir Path dir) {
        assertThrows(NoSuchFileException.class, () -> InputFiles.read(dir.resolve("none.csv"), InputFiles.RUN_LOG));
    }

    @Test
    void refusesAFolderAtOnce(@TempDir Path dir) {
        InputException e = assertThrows(InputException.class, () -> InputFiles.read(dir, InputFiles.CAMPAIGN));
        assertTrue(message(e).contains("is a folder; expected a YAML text file"), message(e));
    }

    @Test
    void refusesAFifoWithoutOpeningIt(@TempDir Path dir) throws Exception {
        Path fifo = dir.resolve("runs.csv");
        boolean made;
        try {
            made = new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0;
        } catch (IOException e) {
            made = false;
        }
        org.junit.jupiter.api.Assumptions.assumeTrue(made, "mkfifo is not available");
        // opening a FIFO with no writer would block forever; the check comes first
        InputException e = assertThrows(InputException.class, () -> InputFiles.read(fifo, InputFiles.RUN_LOG));
        assertTrue(message(e).contains("not a regular file"), message(e));
    }

    @Test
    void refusesAFileAboveTheSizeLimitBeforeReadingIt(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("runs.csv");
        try (RandomAccessFile r = new RandomAccessFile(f.toFile(), "rw")) {
            r.setLength(InputFiles.MAX_TABLE_BYTES + 1); // sparse: no disk space used
        }
        InputException e = assertThrows(InputException.class, () -> InputFiles.read(f, InputFiles.RUN_LOG));
        assertTrue(message(e).contains("larger than 50 MiB"), message(e));
    }

    @Test
    void refusesALineAboveTheLineLimitNamingTheLine(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("campaign.yaml");
        Files.writeString(f, "campaign: x\ntitle: " + "a".repeat(InputFiles.MAX_CAMPAIGN_LINE_BYTES) + "\n");
        InputException e = assertThrows(InputException.class, () -> InputFiles.read(f, InputFiles.CAMPAIGN));
        assertEquals(2, e.diagnostics().get(0).line());
        assertTrue(message(e).contains("at most 64 KiB"), message(e));
        Path ok = dir.resolve("ok.yaml");
        Files.writeString(ok, "title: " + "a".repeat(InputFiles.MAX_CAMPAIGN_LINE_BYTES - 7) + "\n");
        assertEquals(InputFiles.MAX_CAMPAIGN_LINE_BYTES + 1, InputFiles.read(ok, InputFiles.CAMPAIGN).length,
                "a line of exactly the limit is read");
    }

    @Test
    void sizesAreWrittenInBinaryUnits() {
        assertEquals("50 MiB", InputFiles.human(InputFiles.MAX_TABLE_BYTES));
        assertEquals("64 KiB", InputFiles.human(64 * 1024));
        assertEquals("1.5 MiB", InputFiles.human(3 * 512 * 1024));
    }
}
