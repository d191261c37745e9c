package dev.terrace.core.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class SafeFilesTest {

    @Test
    void writesANewFileAndLeavesNoTemporaryBehind(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("sub/out.txt");
        SafeFiles.writeNew(f, "hello");
        assertEquals("hello", Files.readString(f));
        try (Stream<Path> s = Files.list(f.getParent())) {
            assertEquals(1, s.count());
        }
    }

    @Test
    void neverOverwritesWithoutPermission(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("runs.csv");
        Files.writeString(f, "precious");
        assertThrows(FileAlreadyExistsException.class, () -> SafeFiles.writeNew(f, "new"));
        assertThrows(FileAlreadyExistsException.class,
                () -> SafeFiles.write(f, "new".getBytes(StandardCharsets.UTF_8), false));
        assertEquals("precious", Files.readString(f));
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(1, s.count(), "no temporary file is left behind");
        }
    }

    @Test
    void replacesOnlyWhenAsked(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("report.html");
        Files.writeString(f, "old");
        SafeFiles.write(f, "new".getBytes(StandardCharsets.UTF_8), true);
        assertEquals("new", Files.readString(f));
    }
}
