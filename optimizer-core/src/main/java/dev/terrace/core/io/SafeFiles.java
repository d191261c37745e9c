package dev.terrace.core.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * The one way Terrace writes a file, so that nothing the user owns is lost.
 *
 * <ul>
 *   <li>An output that is one of the campaign's inputs (campaign file, run log, candidates file),
 *       reached by any name (symbolic link, {@code ..}, hard link), is refused whatever
 *       {@code --force} says.</li>
 *   <li>A target that exists and is not a regular file (folder, device, FIFO, socket) is refused
 *       without being opened; a missing or unwritable folder is refused unless the caller asked for
 *       folders to be created.</li>
 *   <li>Content goes to a temporary file in the target's folder, is flushed to the disk
 *       ({@link FileChannel#force}) and appears under its name in one atomic step, so a crash or a
 *       kill leaves either the old file or the complete new one. An existing file is replaced only
 *       when asked; a symbolic link target is written through (the link stays).</li>
 *   <li>Any failure removes the temporary file and names the path.</li>
 * </ul>
 *
 * <p>Temporary files are named {@code .NAME}{@value #PARTIAL_MARK}{@code PID-RANDOM}: hidden, without
 * the target's extension, so they are never mistaken for output. A process killed before it could
 * clean up leaves one behind; the next write to the same target removes those whose process is gone.
 *
 * @since 0.1
 */
public final class SafeFiles {

    /** Marks a temporary file in its name. */
    public static final String PARTIAL_MARK = ".terrace-partial-";

    private SafeFiles() {
    }

    /**
     * Writes the content of a file to a stream; may fail with an {@link IOException}.
     *
     * @since 0.1
     */
    @FunctionalInterface
    public interface Content {
        /**
         * @param out where to write; the caller closes it
         * @throws IOException when writing fails
         */
        void writeTo(OutputStream out) throws IOException;
    }

    /**
     * A campaign input that must never be written over.
     *
     * @param file the file as the user named it; never null
     * @param role what it is, for messages ("run log", "campaign file"); never blank
     */
    public record Input(Path file, String role) {
        /** Checks the invariants. */
        public Input {
            Objects.requireNonNull(file, "file");
            if (role == null || role.isBlank()) {
                throw new IllegalArgumentException("blank role");
            }
        }
    }

    /**
     * Where and how to write one file. Immutable; the {@code with…} methods return changed copies.
     *
     * @param path          the file as the user named it; never null
     * @param replace       whether an existing regular file may be replaced (atomically)
     * @param createFolders whether missing parent folders are created
     * @param inputs        campaign inputs that must not be written over; never null
     */
    public record Target(Path path, boolean replace, boolean createFolders, List<Input> inputs) {

        /** Checks the invariants and copies the list. */
        public Target {
            Objects.requireNonNull(path, "path");
            inputs = List.copyOf(inputs);
        }

        /**
         * @param allow whether an existing file may be replaced
         * @return a copy; never null
         */
        public Target replacing(boolean allow) {
            return new Target(path, allow, createFolders, inputs);
        }

        /** @return a copy that creates missing parent folders; never null */
        public Target creatingFolders() {
            return new Target(path, replace, true, inputs);
        }

        /**
         * @param file a campaign input; null is ignored
         * @param role what it is ("run log")
         * @return a copy that also protects {@code file}; never null
         */
        public Target protecting(Path file, String role) {
            if (file == null) {
                return this;
            }
            List<Input> more = new ArrayList<>(inputs);
            more.add(new Input(file, role));
            return new Target(path, replace, createFolders, more);
        }

        /**
         * @param more campaign inputs
         * @return a copy that also protects them; never null
         */
        public Target protecting(List<Input> more) {
            List<Input> all = new ArrayList<>(inputs);
            all.addAll(more);
            return new Target(path, replace, createFolders, all);
        }

        /**
         * Checks that the write would be allowed, without writing anything; commands call this
         * before long work so a refused output is reported at once.
         *
         * @throws OutputRefusedException     when the target may not be written (see the class)
         * @throws FileAlreadyExistsException when it exists and replacing was not asked for
         * @throws IOException                when the file system cannot be asked
         */
        public void check() throws IOException {
            resolve(false);
        }

        /**
         * Writes text as UTF-8.
         *
         * @param text the content; never null
         * @throws IOException as {@link #write(Content)}
         */
        public void write(String text) throws IOException {
            write(text.getBytes(StandardCharsets.UTF_8));
        }

        /**
         * Writes bytes.
         *
         * @param bytes the content; never null
         * @throws IOException as {@link #write(Content)}
         */
        public void write(byte[] bytes) throws IOException {
            Objects.requireNonNull(bytes, "bytes");
            write(out -> out.write(bytes));
        }

        /**
         * Writes the file through a temporary file, flushed to disk and moved into place atomically.
         *
         * @param content writes the content; never null
         * @throws OutputRefusedException     when the target may not be written (nothing was written)
         * @throws FileAlreadyExistsException when it exists and replacing was not asked for
         * @throws OutputFailedException      when writing failed part-way (the target is unchanged and
         *                                    the temporary file removed)
         * @throws IOException                on other failures of the file system
         */
        public void write(Content content) throws IOException {
            Objects.requireNonNull(content, "content");
            Path real = resolve(true);
            Path dir = real.getParent();
            removeStalePartials(dir, real.getFileName().toString());
            Path tmp;
            try {
                tmp = Files.createTempFile(dir, "." + real.getFileName() + PARTIAL_MARK
                        + ProcessHandle.current().pid() + "-", "");
            } catch (AccessDeniedException e) {
                throw new OutputRefusedException(path, "cannot write " + path + ": the folder " + dir
                        + " is not writable; expected a folder you may write to");
            } catch (IOException e) {
                throw failed(e);
            }
            try {
                try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE);
                     OutputStream out = Channels.newOutputStream(ch)) {
                    content.writeTo(out);
                    out.flush();
                    ch.force(true);
                }
                permissions(tmp, real);
                move(tmp, real);
                syncFolder(dir);
            } catch (OutputRefusedException | FileAlreadyExistsException e) {
                throw e;
            } catch (IOException | RuntimeException e) {
                throw failed(e);
            } finally {
                Files.deleteIfExists(tmp);
            }
        }

        private OutputFailedException failed(Exception e) {
            String why = e instanceof FileSystemException && ((FileSystemException) e).getReason() != null
                    ? ((FileSystemException) e).getReason() : String.valueOf(e.getMessage());
            return new OutputFailedException(path, "could not write " + path + ": " + why
                    + "; nothing was written and any earlier file of that name is unchanged", e);
        }

        private void move(Path tmp, Path real) throws IOException {
            // the target may have changed since it was checked
            if (Files.exists(real) && !Files.isRegularFile(real)) {
                throw notRegular(real);
            }
            if (replace) {
                try {
                    Files.move(tmp, real, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, real, StandardCopyOption.REPLACE_EXISTING);
                }
                return;
            }
            try {
                // a hard link appears atomically and fails if the name is taken
                Files.createLink(real, tmp);
            } catch (FileAlreadyExistsException e) {
                throw exists();
            } catch (UnsupportedOperationException | FileSystemException e) {
                try {
                    Files.move(tmp, real); // no REPLACE_EXISTING: fails if the file appeared meanwhile
                } catch (FileAlreadyExistsException e2) {
                    throw exists();
                }
            }
        }

        private FileAlreadyExistsException exists() {
            return new FileAlreadyExistsException(path.toString(), null, "exists; refusing to overwrite");
        }

        private OutputRefusedException notRegular(Path real) {
            String what = Files.isDirectory(real) ? "a folder" : "not a regular file (a device, FIFO or socket)";
            return new OutputRefusedException(path, "cannot write " + path
                    + (real.equals(path) ? "" : " (" + real + ")") + ": it is " + what
                    + "; expected the name of a regular file to write");
        }

        /**
         * Resolves the real file to write and checks every rule.
         *
         * @param making whether missing folders may be created now
         */
        private Path resolve(boolean making) throws IOException {
            Path name = path.getFileName();
            if (name == null || name.toString().equals("..") || name.toString().equals(".")) {
                throw new OutputRefusedException(path, "cannot write " + path + ": it names a folder; expected a file name");
            }
            Path parent = path.toAbsolutePath().getParent();
            if (!Files.exists(parent)) {
                if (!createFolders) {
                    throw new OutputRefusedException(path, "cannot write " + path + ": the folder " + parent
                            + " does not exist; create it first or choose another path");
                }
                if (!making) {
                    return parent.normalize().resolve(name);
                }
                try {
                    Files.createDirectories(parent);
                } catch (FileAlreadyExistsException e) {
                    throw new OutputRefusedException(path, "cannot write " + path + ": " + e.getFile()
                            + " is a file, not a folder");
                } catch (AccessDeniedException e) {
                    throw new OutputRefusedException(path, "cannot create the folder " + parent + " for " + path
                            + ": permission denied");
                }
            }
            if (!Files.isDirectory(parent)) {
                throw new OutputRefusedException(path, "cannot write " + path + ": " + parent
                        + " is a file, not a folder; expected a path inside a folder");
            }
            Path real = parent.toRealPath().resolve(name.toString());
            if (Files.isSymbolicLink(real)) {
                if (!Files.exists(real)) {
                    throw new OutputRefusedException(path, "cannot write " + path + ": it is a symbolic link to "
                            + Files.readSymbolicLink(real) + ", which does not exist; expected a file or a link to one");
                }
                real = real.toRealPath();
            }
            for (Input in : inputs) {
                if (same(in.file(), real)) {
                    throw new OutputRefusedException(path, "refusing to write " + path + ": it is the " + in.role()
                            + " " + in.file() + ", an input of the campaign; Terrace never writes over its inputs,"
                            + " with or without --force; choose another file name");
                }
            }
            if (Files.exists(real)) {
                if (!Files.isRegularFile(real)) {
                    throw notRegular(real);
                }
                if (!replace) {
                    throw exists();
                }
            }
            if (!Files.isWritable(real.getParent())) {
                throw new OutputRefusedException(path, "cannot write " + path + ": the folder " + real.getParent()
                        + " is not writable; expected a folder you may write to");
            }
            return real;
        }
    }

    /**
     * @param path the file to write
     * @return a target that neither replaces nor creates folders and protects nothing yet; never null
     */
    public static Target target(Path path) {
        return new Target(path, false, false, List.of());
    }

    /**
     * Writes a new file, creating missing folders; fails if one exists already.
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
     * Writes a file, creating missing folders and replacing an existing one only when
     * {@code replace} is true.
     *
     * @param target  the file
     * @param bytes   its content
     * @param replace whether an existing file may be replaced (atomically)
     * @throws FileAlreadyExistsException when the file exists and {@code replace} is false
     * @throws IOException                on other write failures
     */
    public static void write(Path target, byte[] bytes, boolean replace) throws IOException {
        target(target).replacing(replace).creatingFolders().write(bytes);
    }

    /** Whether a campaign input and the real target are one file, by any name. */
    static boolean same(Path input, Path real) throws IOException {
        if (Files.exists(input) && Files.exists(real)) {
            return Files.isSameFile(input, real); // symbolic links, '..', hard links (same file key)
        }
        return canonical(input).equals(real);
    }

    private static Path canonical(Path p) throws IOException {
        if (Files.exists(p)) {
            return p.toRealPath();
        }
        Path parent = p.toAbsolutePath().getParent();
        if (parent != null && Files.isDirectory(parent) && p.getFileName() != null) {
            return parent.toRealPath().resolve(p.getFileName().toString());
        }
        return p.toAbsolutePath().normalize();
    }

    /** Removes temporary files of this target left by Terrace processes that no longer run. */
    private static void removeStalePartials(Path dir, String name) {
        String prefix = "." + name + PARTIAL_MARK;
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir, p -> p.getFileName().toString().startsWith(prefix))) {
            for (Path p : s) {
                String rest = p.getFileName().toString().substring(prefix.length());
                int dash = rest.indexOf('-');
                Optional<Long> pid = Optional.empty();
                try {
                    pid = Optional.of(Long.parseLong(dash < 0 ? rest : rest.substring(0, dash)));
                } catch (NumberFormatException e) {
                    // not one of ours
                }
                if (pid.isPresent() && ProcessHandle.of(pid.get()).map(ProcessHandle::isAlive).orElse(false)) {
                    continue; // another Terrace writing the same file right now
                }
                if (pid.isPresent() && Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)) {
                    Files.deleteIfExists(p);
                }
            }
        } catch (IOException e) {
            // leftovers stay; they are hidden and clearly named
        }
    }

    /** Gives the temporary file the permissions of the file it replaces, or rw-r--r-- for a new one. */
    private static void permissions(Path tmp, Path target) {
        try {
            if (!Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
                return;
            }
            Set<PosixFilePermission> perms = Files.exists(target)
                    ? Files.getPosixFilePermissions(target)
                    : PosixFilePermissions.fromString("rw-r--r--");
            Files.setPosixFilePermissions(tmp, perms);
        } catch (IOException | UnsupportedOperationException e) {
            // keep the temporary file's permissions
        }
    }

    /** Flushes the folder entry of the moved file to disk where the platform allows it. */
    private static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | RuntimeException e) {
            // not every platform can open a folder; the file itself was forced already
        }
    }
}
