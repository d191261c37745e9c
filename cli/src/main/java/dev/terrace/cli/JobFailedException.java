package dev.terrace.cli;

/**
 * The job ran but could not produce its result (exit code 1); the message says why in plain words.
 *
 * @since 0.1
 */
public final class JobFailedException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /**
     * @param message what failed and what the grower can do about it
     */
    public JobFailedException(String message) {
        super(message);
    }
}
