package dev.terrace.cli;

/**
 * The user asked for something that cannot be done as asked (exit code 2); the message names the
 * option or path and what was expected.
 *
 * @since 0.1
 */
public final class UsageException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /**
     * @param message what is wrong, naming the option or path, and what was expected
     */
    public UsageException(String message) {
        super(message);
    }
}
