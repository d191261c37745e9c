package dev.terrace.core.campaign;

import java.nio.file.Path;
import java.util.Objects;

/**
 * An earlier campaign named under {@code priors:} whose fitted physics parameters become priors of
 * this campaign's fit.
 *
 * @param file     the earlier campaign file, resolved against this campaign file's folder; never null
 * @param written  the path as written in the campaign file; never null
 * @param position where it is written; never null
 * @since 0.3
 */
public record PriorSource(Path file, String written, SourcePosition position) {
    /** Checks the invariants. */
    public PriorSource {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(written, "written");
        Objects.requireNonNull(position, "position");
    }
}
