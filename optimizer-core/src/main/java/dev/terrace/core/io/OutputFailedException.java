package dev.terrace.core.io;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Objects;

/**
 * Writing a file failed part-way (disk full, input/output error) although the request was valid
 * (exit code 1). The temporary file was removed and the target is unchanged.
 *
 * @since 0.1
 */
public final class OutputFailedException extends IOException {
    private static final long serialVersionUID = 1L;

    private final transient Path target;

    /**
     * @param target  the file that was not written; never null
     * @param message the whole sentence to show, naming the path; never null
     * @param cause   the failure; may be null
     */
    public OutputFailedException(Path target, String message, Throwable cause) {
        super(Objects.requireNonNull(message, "message"), cause);
        this.target = Objects.requireNonNull(target, "target");
    }

    /** @return the file that was not written; never null */
    public Path target() {
        return target;
    }
}
