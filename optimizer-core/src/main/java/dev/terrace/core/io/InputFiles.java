package dev.terrace.core.io;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.Arrays;
import java.util.Objects;

/**
 * The one way Terrace reads a user's file: only a regular file of sane size is opened, and the read
 * itself is bounded, so a device, FIFO, folder or runaway file is refused at once with the limit
 * named instead of filling the memory.
 *
 * @since 0.1
 */
public final class InputFiles {

    /** Largest run log or candidates file read: 50 MiB, hundreds of thousands of runs. */
    public static final long MAX_TABLE_BYTES = 50L * 1024 * 1024;
    /** Longest line of a run log or candidates file: 1 MiB. */
    public static final int MAX_TABLE_LINE_BYTES = 1024 * 1024;
    /**
     * Largest campaign file read: 8 MiB, room for tens of thousands of parameters. The YAML parser
     * is given the same limit in code points.
     */
    public static final long MAX_CAMPAIGN_BYTES = 8L * 1024 * 1024;
    /**
     * Longest line of a campaign file: 64 KiB. The YAML scanner's time grows with the square of a
     * plain value's length (measured: a 1 MiB value takes about 3 s, a 5 MB one about 40 s), so
     * long lines are refused before parsing.
     */
    public static final int MAX_CAMPAIGN_LINE_BYTES = 64 * 1024;

    /**
     * What kind of file is read, for messages, and its limits.
     *
     * @param what         the file's role, as in "run log"; never blank
     * @param expected     what a good file is, as in "a CSV text file"; never blank
     * @param maxBytes     largest size accepted, bytes; positive
     * @param maxLineBytes longest line accepted, bytes; positive
     */
    public record Kind(String what, String expected, long maxBytes, int maxLineBytes) {
        /** Checks the invariants. */
        public Kind {
            if (what == null || what.isBlank() || expected == null || expected.isBlank()) {
                throw new IllegalArgumentException("blank description");
            }
            if (maxBytes <= 0 || maxLineBytes <= 0) {
                throw new IllegalArgumentException("limits must be positive");
            }
        }
    }

    /** A campaign file. */
    public static final Kind CAMPAIGN = new Kind("campaign file", "a YAML text file", MAX_CAMPAIGN_BYTES,
            MAX_CAMPAIGN_LINE_BYTES);
    /** A run log. */
    public static final Kind RUN_LOG = new Kind("run log", "a CSV text file", MAX_TABLE_BYTES, MAX_TABLE_LINE_BYTES);
    /** A candidates file for ranking. */
    public static final Kind CANDIDATES = new Kind("candidate file", "a CSV text file", MAX_TABLE_BYTES,
            MAX_TABLE_LINE_BYTES);

    private InputFiles() {
    }

    /**
     * Reads a file's bytes after checking that it is a regular file within the limits.
     *
     * @param file the file; never null
     * @param kind what it is; never null
     * @return the bytes; never null
     * @throws java.nio.file.NoSuchFileException when the file does not exist (callers word that message themselves)
     * @throws InputException      when it is a folder, device or FIFO, is unreadable, too big or has
     *                             a line too long
     * @throws IOException         on other read failures
     */
    public static byte[] read(Path file, Kind kind) throws IOException, InputException {
        long size = requireRegular(file, kind);
        byte[] buf = new byte[(int) Math.min(Math.max(size + 1, 8192), kind.maxBytes() + 1)];
        int n = 0;
        try (InputStream in = Files.newInputStream(file)) {
            while (true) {
                if (n == buf.length) {
                    if (buf.length > kind.maxBytes()) {
                        throw tooBig(file, kind); // the file grew while it was read
                    }
                    buf = Arrays.copyOf(buf, (int) Math.min((long) buf.length * 2, kind.maxBytes() + 1));
                }
                int r = in.read(buf, n, buf.length - n);
                if (r < 0) {
                    break;
                }
                n += r;
            }
        } catch (AccessDeniedException e) {
            throw refuse(file, 0, "the " + kind.what() + " cannot be read: permission denied");
        }
        return checked(file, kind, buf, n);
    }

    /**
     * Reads a file's bytes through a channel already open on it (for a file read under a lock:
     * on POSIX systems closing any other descriptor of a file drops the process's lock on it),
     * with the same checks and limits as {@link #read(Path, Kind)}.
     *
     * @param file    the file the channel is open on, for the checks and messages; never null
     * @param kind    what it is; never null
     * @param channel a channel open for reading on {@code file}, read from position 0; not closed; never null
     * @return the bytes; never null
     * @throws InputException when it is a folder, device or FIFO, too big or has a line too long
     * @throws IOException    on read failures
     */
    public static byte[] read(Path file, Kind kind, FileChannel channel) throws IOException, InputException {
        Objects.requireNonNull(channel, "channel");
        long size = requireRegular(file, kind);
        ByteBuffer buf = ByteBuffer.allocate((int) Math.min(Math.max(size + 1, 8192), kind.maxBytes() + 1));
        long at = 0;
        while (true) {
            if (!buf.hasRemaining()) {
                if (buf.capacity() > kind.maxBytes()) {
                    throw tooBig(file, kind); // the file grew while it was read
                }
                ByteBuffer bigger = ByteBuffer.allocate((int) Math.min((long) buf.capacity() * 2, kind.maxBytes() + 1));
                buf.flip();
                bigger.put(buf);
                buf = bigger;
            }
            int r = channel.read(buf, at);
            if (r < 0) {
                break;
            }
            at += r;
        }
        return checked(file, kind, buf.array(), buf.position());
    }

    /**
     * Checks, without opening it, that a file is a regular file within the size limit.
     *
     * @param file the file; never null
     * @param kind what it is; never null
     * @return the file's size, bytes
     * @throws java.nio.file.NoSuchFileException when the file does not exist
     * @throws InputException when it is a folder, device or FIFO, or too big
     * @throws IOException    when its attributes cannot be read
     */
    public static long requireRegular(Path file, Kind kind) throws IOException, InputException {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(kind, "kind");
        BasicFileAttributes a = Files.readAttributes(file, BasicFileAttributes.class); // follows links
        if (a.isDirectory()) {
            throw refuse(file, 0, "the " + kind.what() + " is a folder; expected " + kind.expected());
        }
        if (!a.isRegularFile()) {
            throw refuse(file, 0, "the " + kind.what() + " is not a regular file (a device, FIFO or socket);"
                    + " expected " + kind.expected());
        }
        if (a.size() > kind.maxBytes()) {
            throw tooBig(file, kind);
        }
        return a.size();
    }

    /** The first {@code n} bytes of {@code buf} after the size and line-length checks. */
    private static byte[] checked(Path file, Kind kind, byte[] buf, int n) throws InputException {
        if (n > kind.maxBytes()) {
            throw tooBig(file, kind);
        }
        byte[] bytes = n == buf.length ? buf : Arrays.copyOf(buf, n);
        checkLines(file, kind, bytes);
        return bytes;
    }

    private static void checkLines(Path file, Kind kind, byte[] bytes) throws InputException {
        int line = 1;
        int start = 0;
        for (int i = 0; i <= bytes.length; i++) {
            if (i == bytes.length || bytes[i] == '\n') {
                if (i - start > kind.maxLineBytes()) {
                    throw refuse(file, line, "line " + line + " is " + human(i - start) + " long; a "
                            + kind.what() + " line may be at most " + human(kind.maxLineBytes()));
                }
                line++;
                start = i + 1;
            }
        }
    }

    private static InputException tooBig(Path file, Kind kind) {
        return refuse(file, 0, "the " + kind.what() + " is larger than " + human(kind.maxBytes())
                + ", the most Terrace reads; expected " + kind.expected() + " of at most that size");
    }

    private static InputException refuse(Path file, int line, String message) {
        return new InputException(Diagnostic.error(file, line, 0, message));
    }

    /** @return a size in KiB or MiB, as in "50 MiB" */
    static String human(long bytes) {
        if (bytes >= 1024 * 1024 && bytes % (1024 * 1024) == 0) {
            return bytes / (1024 * 1024) + " MiB";
        }
        if (bytes >= 1024 * 1024) {
            return String.format(java.util.Locale.ROOT, "%.1f MiB", bytes / (1024.0 * 1024));
        }
        if (bytes >= 1024) {
            return bytes / 1024 + " KiB";
        }
        return bytes + " bytes";
    }
}
