/**
 * The proposal journal: every batch {@code terrace propose} made, one JSON line per batch, appended
 * beside the campaign, and the track record that compares those predictions with what was grown.
 *
 * <p>{@link dev.terrace.core.journal.Journal} reads and appends the file;
 * {@link dev.terrace.core.journal.JournalEntry} and {@link dev.terrace.core.journal.JournalProposal}
 * are its values; {@link dev.terrace.core.journal.TrackRecord} matches the run log's
 * {@code proposal} column against it.
 *
 * @since 0.2
 */
package dev.terrace.core.journal;
