package dev.terrace.core.io;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Objects;

/**
 * Terrace refused to write a file because of what the user asked for (exit code 2): the target is
 * one of the campaign's inputs, is a folder, device or FIFO, sits in a folder that is missing or
 * not writable. Nothing was written and the target is unchanged.
 *
 * @since 0.1
 */
public final class OutputRefusedException extends IOException {
    private static final long serialVersionUID = 1L;

    private final transient Path target;

    /**
     * @param target  the file that was not written; never null
     * @param message the whole sentence to show, naming the path(s) and what was expected; never null
     */
    public OutputRefusedException(Path target, String message) {
        super(Objects.requireNonNull(message, "message"));
        this.target = Objects.requireNonNull(target, "target");
    }

    /** @return the file that was not written; never null */
    public Path target() {
        return target;
    }
}
