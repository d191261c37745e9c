package dev.terrace.core.journal;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.io.InputFiles;
import dev.terrace.core.io.OutputFailedException;
import dev.terrace.core.io.OutputRefusedException;
import dev.terrace.core.propose.Proposals.ProposalSet;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;

/**
 * A campaign's proposal journal: one line of JSON per batch {@code terrace propose} made, in the
 * order they were made (JSON Lines).
 *
 * <p><b>Appending.</b> A batch is appended as one line in a single write to a file opened for
 * appending ({@code O_APPEND}), under an exclusive lock on the journal ({@link FileChannel#lock()})
 * and a lock within this process, then flushed to the disk ({@link FileChannel#force}). Earlier
 * lines are never rewritten or moved: appending one line is the smallest change that can be made,
 * and no crash can reach a byte that was already there. Rewriting the whole file through a
 * temporary copy would also be atomic, but would need a lock on a second file (the renamed file
 * is a new one) and would rewrite every earlier batch each time. Two processes or threads
 * appending at once each get their own whole line.
 *
 * <p><b>A crash while appending</b> can at worst leave the last line cut short. Reading ignores
 * such a line with a warning that names it; the next append first ends it with a line break, so
 * it stays an ignored line and never glues onto the new batch. A line that is not a journal
 * entry (cut short, edited by hand, another layout version) is likewise skipped with a warning:
 * the journal is a record, and one damaged batch should not stop {@code check} or {@code record}.
 *
 * @param file     the journal file; never null
 * @param entries  the batches read, in file order; never null
 * @param warnings lines skipped and why, with their line numbers; never null
 * @since 0.2
 */
public record Journal(Path file, List<JournalEntry> entries, List<Diagnostic> warnings) {

    /** Largest journal read: 64 MiB, about ten thousand batches of ten proposals. */
    public static final long MAX_BYTES = 64L * 1024 * 1024;
    /** Longest journal line: 4 MiB, room for a batch of 100 proposals with many settings. */
    public static final int MAX_LINE_BYTES = 4 * 1024 * 1024;
    /** The journal as a kind of input file, for size limits and messages. */
    public static final InputFiles.Kind KIND = new InputFiles.Kind("proposal journal",
            "a JSON Lines text file written by terrace propose", MAX_BYTES, MAX_LINE_BYTES);

    /** Locks within this process, by real path; {@link FileChannel#lock()} only excludes other processes. */
    private static final ConcurrentHashMap<Path, Object> LOCAL_LOCKS = new ConcurrentHashMap<>();

    /** Copies the lists. */
    public Journal {
        Objects.requireNonNull(file, "file");
        entries = List.copyOf(entries);
        warnings = List.copyOf(warnings);
    }

    /**
     * A proposal found in the journal with the batch it belongs to.
     *
     * @param entry    the batch; never null
     * @param proposal the proposal; never null
     */
    public record Found(JournalEntry entry, JournalProposal proposal) {
        /** Checks the invariants. */
        public Found {
            Objects.requireNonNull(entry, "entry");
            Objects.requireNonNull(proposal, "proposal");
        }
    }

    /**
     * Reads a journal. A missing file is an empty journal: no batch was proposed yet (or every
     * propose ran with {@code --no-journal}).
     *
     * @param file       the journal file; never null
     * @param campaignId the campaign it belongs to; lines of another campaign are skipped with a warning
     * @return the journal; never null
     * @throws InputException when the file is a folder or device, unreadable, too big or not UTF-8
     * @throws IOException    on other read failures
     */
    public static Journal read(Path file, String campaignId) throws IOException, InputException {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(campaignId, "campaignId");
        byte[] bytes;
        try {
            bytes = InputFiles.read(file, KIND);
        } catch (NoSuchFileException e) {
            return new Journal(file, List.of(), List.of());
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "the proposal journal is not UTF-8 text;"
                    + " expected the JSON lines terrace propose writes"));
        }
        return parse(file, text, campaignId);
    }

    /**
     * Parses journal text.
     *
     * @param file       the name diagnostics carry; never null
     * @param text       the journal text; never null
     * @param campaignId the campaign it belongs to
     * @return the journal; never null
     */
    static Journal parse(Path file, String text, String campaignId) {
        List<JournalEntry> entries = new ArrayList<>();
        List<Diagnostic> warnings = new ArrayList<>();
        String[] lines = text.split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i].endsWith("\r") ? lines[i].substring(0, lines[i].length() - 1) : lines[i];
            if (line.isBlank()) {
                continue;
            }
            boolean last = i == lines.length - 1; // no line break after it
            try {
                JournalEntry e = JournalCodec.fromLine(line, i + 1);
                if (!e.campaignId().equals(campaignId)) {
                    warnings.add(Diagnostic.warning(file, i + 1, 0, "this batch belongs to campaign '"
                            + e.campaignId() + "', not '" + campaignId + "'; it is ignored"));
                    continue;
                }
                entries.add(e);
            } catch (IllegalArgumentException ex) {
                warnings.add(Diagnostic.warning(file, i + 1, 0, last
                        ? "the last line is incomplete (" + ex.getMessage() + "): a propose was probably"
                        + " interrupted while writing it; it is ignored, and the next propose starts a new line"
                        : "this line is not a journal entry (" + ex.getMessage() + "); it is ignored"
                        + " (a write cut short by a crash, or an edit by hand; expected one JSON object per line"
                        + " as terrace propose writes it)"));
            }
        }
        return new Journal(file, entries, warnings);
    }

    /**
     * The batch a run most likely followed for a proposal id: the latest batch holding the id made
     * on or before the run's date, else the latest batch holding it.
     *
     * @param proposalId a proposal id; never null
     * @param runDate    the run's date, or null when unknown
     * @return the proposal and its batch, or empty when no batch holds the id
     */
    public Optional<Found> find(String proposalId, LocalDate runDate) {
        Objects.requireNonNull(proposalId, "proposalId");
        Found latest = null;
        Found latestBefore = null;
        for (JournalEntry e : entries) {
            Optional<JournalProposal> p = e.proposal(proposalId);
            if (p.isEmpty()) {
                continue;
            }
            Found f = new Found(e, p.get());
            latest = f;
            if (runDate != null && !LocalDate.ofInstant(e.time(), java.time.ZoneOffset.UTC).isAfter(runDate)) {
                latestBefore = f;
            }
        }
        return Optional.ofNullable(latestBefore != null ? latestBefore : latest);
    }

    /** @return the last batch, if any */
    public Optional<JournalEntry> latest() {
        return entries.isEmpty() ? Optional.empty() : Optional.of(entries.get(entries.size() - 1));
    }

    /**
     * Checks, before long work, that a batch could be appended: the journal is a regular file (or
     * does not exist yet) in a folder that exists.
     *
     * @param file the journal file; never null
     * @throws OutputRefusedException when it is a folder, device or FIFO, or its folder is missing
     * @throws IOException            when the file system cannot be asked
     */
    public static void checkAppendable(Path file) throws IOException {
        Objects.requireNonNull(file, "file");
        if (Files.exists(file) && !Files.isRegularFile(file)) {
            throw new OutputRefusedException(file, "cannot append to the proposal journal " + file + ": it is "
                    + (Files.isDirectory(file) ? "a folder" : "not a regular file (a device, FIFO or socket)")
                    + "; expected a file (name another with the campaign's 'journal:' key, or use --no-journal)");
        }
        Path parent = file.toAbsolutePath().getParent();
        if (parent == null || !Files.isDirectory(parent)) {
            throw new OutputRefusedException(file, "cannot append to the proposal journal " + file
                    + ": the folder " + parent + " does not exist");
        }
        if (!Files.exists(file) && !Files.isWritable(parent)) {
            throw new OutputRefusedException(file, "cannot create the proposal journal " + file + ": the folder "
                    + parent + " is not writable (use --no-journal to propose without it)");
        }
    }

    /**
     * Appends one batch as one line (see the class notes). The file is created when missing.
     *
     * @param file  the journal file; never null
     * @param entry the batch; never null
     * @throws OutputRefusedException when the journal may not be written (see {@link #checkAppendable})
     * @throws OutputFailedException  when the write failed; earlier lines are untouched
     * @throws IOException            on other failures of the file system
     */
    public static void append(Path file, JournalEntry entry) throws IOException {
        Objects.requireNonNull(entry, "entry");
        checkAppendable(file);
        Path real = Files.exists(file) ? file.toRealPath() : file.toAbsolutePath().normalize();
        byte[] line = (JournalCodec.toLine(entry) + "\n").getBytes(StandardCharsets.UTF_8);
        boolean created = !Files.exists(real);
        synchronized (LOCAL_LOCKS.computeIfAbsent(real, k -> new Object())) {
            try (FileChannel ch = FileChannel.open(real, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                    StandardOpenOption.APPEND);
                 FileLock lock = ch.lock()) {
                byte[] out = line;
                long size = ch.size();
                if (size > 0 && lastByte(real, size) != '\n') {
                    // a line cut short by a crash: end it, so it stays one ignored line
                    out = new byte[line.length + 1];
                    out[0] = '\n';
                    System.arraycopy(line, 0, out, 1, line.length);
                }
                ByteBuffer buf = ByteBuffer.wrap(out);
                while (buf.hasRemaining()) {
                    ch.write(buf);
                }
                ch.force(true);
            } catch (AccessDeniedException e) {
                throw new OutputRefusedException(file, "cannot append to the proposal journal " + file
                        + ": permission denied (use --no-journal to propose without it)");
            } catch (IOException e) {
                if (e instanceof OutputRefusedException) {
                    throw e;
                }
                throw new OutputFailedException(file, "could not append to the proposal journal " + file + ": "
                        + e.getMessage() + "; its earlier lines are unchanged", e);
            }
        }
        if (created) {
            syncFolder(real.getParent());
        }
    }

    /**
     * Appends a batch just proposed, with the checksums of the campaign file and run log it was
     * made from, to the campaign's journal.
     *
     * @param lc   the campaign the batch was made for; never null
     * @param set  the batch; never null
     * @param time when it was made (kept to the second); never null
     * @return the journal file; never null
     * @throws IOException as {@link #append}, or when the inputs cannot be read for their checksums
     */
    public static Path appendBatch(LoadedCampaign lc, ProposalSet set, Instant time) throws IOException {
        Objects.requireNonNull(lc, "lc");
        Path file = lc.campaign().journal();
        append(file, JournalEntry.of(set, time.truncatedTo(java.time.temporal.ChronoUnit.SECONDS),
                sha256(lc.campaign().file()), sha256(lc.runLog().file())));
        return file;
    }

    /**
     * @param file a file; never null
     * @return the SHA-256 of its bytes, 64 lower-case hex digits
     * @throws IOException when it cannot be read
     */
    public static String sha256(Path file) throws IOException {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            return HexFormat.of().formatHex(md.digest(Files.readAllBytes(file)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java", e);
        }
    }

    private static byte lastByte(Path file, long size) throws IOException {
        try (FileChannel r = FileChannel.open(file, StandardOpenOption.READ)) {
            ByteBuffer one = ByteBuffer.allocate(1);
            r.read(one, size - 1);
            return one.get(0);
        }
    }

    private static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | RuntimeException e) {
            // not every platform can open a folder; the file itself was forced already
        }
    }
}
