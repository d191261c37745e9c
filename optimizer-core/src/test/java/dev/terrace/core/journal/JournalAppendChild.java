package dev.terrace.core.journal;

import java.nio.file.Path;
import java.time.Instant;

/** Run in a child JVM by {@link JournalTest}: appends batches to a journal as fast as it can. */
public final class JournalAppendChild {

    private JournalAppendChild() {
    }

    /**
     * @param args the journal file, a tag, how many batches
     * @throws Exception on failure (the child exits non-zero)
     */
    public static void main(String[] args) throws Exception {
        Path file = Path.of(args[0]);
        int n = Integer.parseInt(args[2]);
        for (int k = 0; k < n; k++) {
            Journal.append(file, JournalFixtures.batch(args[1] + k, 3, Instant.parse("2026-03-01T10:00:00Z")));
        }
    }
}
