package dev.terrace.core.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

class SafeFilesTest {

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void writesANewFileAndLeavesNoTemporaryBehind(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("sub/out.txt");
        SafeFiles.writeNew(f, "hello");
        assertEquals("hello", Files.readString(f));
        assertEquals(List.of("out.txt"), names(f.getParent()));
    }

    @Test
    void neverOverwritesWithoutPermission(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("runs.csv");
        Files.writeString(f, "precious");
        assertThrows(FileAlreadyExistsException.class, () -> SafeFiles.writeNew(f, "new"));
        assertThrows(FileAlreadyExistsException.class,
                () -> SafeFiles.write(f, "new".getBytes(StandardCharsets.UTF_8), false));
        assertEquals("precious", Files.readString(f));
        assertEquals(1, names(dir).size(), "no temporary file is left behind");
    }

    @Test
    void replacesOnlyWhenAsked(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("report.html");
        Files.writeString(f, "old");
        SafeFiles.write(f, "new".getBytes(StandardCharsets.UTF_8), true);
        assertEquals("new", Files.readString(f));
    }

    @Test
    void refusesAnInputByEveryNameWhateverReplaceSays(@TempDir Path dir) throws Exception {
        Path log = dir.resolve("runs.csv");
        Files.writeString(log, "run_id\nR1\n");
        Files.createDirectories(dir.resolve("sub"));
        Path link = dir.resolve("alias.csv");
        Files.createSymbolicLink(link, log.getFileName());
        Path hard = dir.resolve("hard.csv");
        Files.createLink(hard, log);
        for (Path name : List.of(log, dir.resolve("sub/../runs.csv"), link, hard)) {
            SafeFiles.Target t = SafeFiles.target(name).replacing(true).protecting(log, "run log");
            OutputRefusedException e = assertThrows(OutputRefusedException.class, () -> t.write("proposals"), name.toString());
            assertTrue(e.getMessage().contains(name.toString()) && e.getMessage().contains(log.toString()), e.getMessage());
        }
        assertEquals("run_id\nR1\n", Files.readString(log));
        assertTrue(Files.isSymbolicLink(link), "the link itself is kept");
        assertEquals(List.of("alias.csv", "hard.csv", "runs.csv", "sub"), names(dir));
    }

    @Test
    void refusesAnInputThatDoesNotExistYet(@TempDir Path dir) throws Exception {
        Path log = dir.resolve("runs.csv");
        SafeFiles.Target t = SafeFiles.target(dir.resolve("./runs.csv")).protecting(log, "run log");
        assertThrows(OutputRefusedException.class, t::check);
        assertFalse(Files.exists(log));
    }

    @Test
    void writesThroughALinkToAnotherFileAndKeepsTheLink(@TempDir Path dir) throws Exception {
        Path real = dir.resolve("report-2027.html");
        Files.writeString(real, "old");
        Path link = dir.resolve("latest.html");
        Files.createSymbolicLink(link, real.getFileName());
        SafeFiles.target(link).replacing(true).write("new");
        assertTrue(Files.isSymbolicLink(link));
        assertEquals("new", Files.readString(real));
    }

    @Test
    void refusesFoldersFifosAndPathsBelowAFile(@TempDir Path dir) throws Exception {
        Path folder = Files.createDirectories(dir.resolve("plots"));
        assertThrows(OutputRefusedException.class, () -> SafeFiles.target(folder).replacing(true).write("x"));
        Path file = Files.writeString(dir.resolve("notes.txt"), "keep");
        OutputRefusedException below = assertThrows(OutputRefusedException.class,
                () -> SafeFiles.target(file.resolve("out.csv")).write("x"));
        assertTrue(below.getMessage().contains("is a file, not a folder"), below.getMessage());
        OutputRefusedException missing = assertThrows(OutputRefusedException.class,
                () -> SafeFiles.target(dir.resolve("nowhere/out.csv")).write("x"));
        assertTrue(missing.getMessage().contains("does not exist"), missing.getMessage());
        Path fifo = dir.resolve("pipe");
        boolean made;
        try {
            made = new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0;
        } catch (IOException e) {
            made = false;
        }
        if (made) {
            // refused without being opened: opening a FIFO for writing would block
            OutputRefusedException e = assertThrows(OutputRefusedException.class,
                    () -> SafeFiles.target(fifo).replacing(true).write("x"));
            assertTrue(e.getMessage().contains("not a regular file"), e.getMessage());
            assertFalse(Files.isRegularFile(fifo));
        }
        assertEquals("keep", Files.readString(file));
        assertEquals(made ? List.of("notes.txt", "pipe", "plots") : List.of("notes.txt", "plots"), names(dir));
    }

    @Test
    void aFailureWhileWritingRemovesTheTemporaryFileAndKeepsTheOldOne(@TempDir Path dir) throws Exception {
        Path f = Files.writeString(dir.resolve("proposals.csv"), "old");
        SafeFiles.Target t = SafeFiles.target(f).replacing(true);
        OutputFailedException e = assertThrows(OutputFailedException.class, () -> t.write(out -> {
            out.write("half a ta".getBytes(StandardCharsets.UTF_8));
            throw new IOException("No space left on device");
        }));
        assertTrue(e.getMessage().contains(f.toString()) && e.getMessage().contains("No space left"), e.getMessage());
        assertEquals("old", Files.readString(f));
        assertEquals(List.of("proposals.csv"), names(dir));
    }

    @Test
    void refusesAReadOnlyFolder(@TempDir Path dir) throws Exception {
        Path ro = Files.createDirectories(dir.resolve("ro"));
        assumeTrue(ro.toFile().setWritable(false, false));
        try {
            assumeTrue(!Files.isWritable(ro), "running as a user who may write anywhere (root)");
            OutputRefusedException e = assertThrows(OutputRefusedException.class,
                    () -> SafeFiles.target(ro.resolve("r.html")).write("x"));
            assertTrue(e.getMessage().contains("not writable"), e.getMessage());
        } finally {
            ro.toFile().setWritable(true, false);
        }
    }

    @Test
    void removesTemporaryFilesLeftByProcessesThatAreGone(@TempDir Path dir) throws Exception {
        Process p = new ProcessBuilder("true").start();
        p.waitFor();
        long dead = p.pid(); // finished, so not alive any more
        Path stale = Files.writeString(dir.resolve(".report.html" + SafeFiles.PARTIAL_MARK + dead + "-123"), "<html");
        Path live = Files.writeString(dir.resolve(".report.html" + SafeFiles.PARTIAL_MARK
                + ProcessHandle.current().pid() + "-456"), "<ht");
        SafeFiles.target(dir.resolve("report.html")).write("<html></html>");
        assertFalse(Files.exists(stale));
        assertTrue(Files.exists(live), "a live process's temporary file is left to it");
        assertEquals("<html></html>", Files.readString(dir.resolve("report.html")));
    }
}
