package dev.terrace.core.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes files so that nothing the user owns is lost: content goes to a temporary file in the
 * same folder first and appears under its name in one step, and an existing file is never
 * replaced unless the caller asks for it.
 *
 * @since 0.1
 */
public final class SafeFiles {

    private SafeFiles() {
    }

    /** Gives the temporary file the permissions of the file it replaces, or rw-r--r-- for a new one. */
    private static void permissions(Path tmp, Path target) {
        try {
            if (!Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
                return;
            }
            java.util.Set<java.nio.file.attribute.PosixFilePermission> perms = Files.exists(target)
                    ? Files.getPosixFilePermissions(target)
                    : java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--");
            Files.setPosixFilePermissions(tmp, perms);
        } catch (IOException | UnsupportedOperationException e) {
            // keep the temporary file's permissions
        }
    }

    /**
     * Writes a new file; fails if one exists already.
     *
     * @param target the file to create
     * @param text   its content (UTF-8)
     * @throws FileAlreadyExistsException when {@code target} exists (it is left untouched)
     * @throws IOException                on other write failures (no partial file is left behind)
     */
    public static void writeNew(Path target, String text) throws IOException {
        write(target, text.getBytes(StandardCharsets.UTF_8), false);
    }

    /**
     * Writes a file, replacing an existing one only when {@code replace} is true.
     *
     * @param target  the file
     * @param bytes   its content
     * @param replace whether an existing file may be replaced (atomically)
     * @throws FileAlreadyExistsException when the file exists and {@code replace} is false
     * @throws IOException                on other write failures
     */
    public static void write(Path target, byte[] bytes, boolean replace) throws IOException {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir != null) {
            Files.createDirectories(dir);
        }
        if (!replace && Files.exists(abs)) {
            throw new FileAlreadyExistsException(target.toString(), null, "exists; refusing to overwrite");
        }
        Path tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".part");
        try {
            Files.write(tmp, bytes);
            permissions(tmp, abs);
            if (replace) {
                try {
                    Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
                }
            } else {
                try {
                    // a hard link appears atomically and fails if the name is taken
                    Files.createLink(abs, tmp);
                } catch (UnsupportedOperationException | java.nio.file.FileSystemException e) {
                    if (e instanceof FileAlreadyExistsException) {
                        throw e;
                    }
                    Files.move(tmp, abs); // no REPLACE_EXISTING: fails if the file appeared meanwhile
                }
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
