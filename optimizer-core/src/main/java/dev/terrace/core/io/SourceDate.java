package dev.terrace.core.io;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Map;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * The date and time Terrace writes into files, honouring {@value #VARIABLE} as the
 * reproducible-builds.org specification defines it (https://reproducible-builds.org/specs/source-date-epoch/):
 * when the variable is set, every date written is that instant, in UTC, so the same inputs and
 * seed give the same bytes on any day; when it is unset (or empty) the system clock and time zone
 * are used. A value that is not a whole number of seconds since 1970-01-01T00:00:00Z is refused,
 * as the specification asks, rather than silently ignored.
 *
 * @since 0.3
 */
public final class SourceDate {

    /** The environment variable. */
    public static final String VARIABLE = "SOURCE_DATE_EPOCH";

    /** Decimal digits only, as {@code date +%s} prints them (a leading minus for dates before 1970). */
    private static final Pattern SECONDS = Pattern.compile("-?[0-9]{1,19}");

    private SourceDate() {
    }

    /**
     * The clock for dates written into files.
     *
     * @param environment the process environment (usually {@code System.getenv()}); never null
     * @return a fixed UTC clock at {@value #VARIABLE} when set, else the system clock in the default zone
     * @throws IllegalArgumentException when the variable is set but is not a whole number of seconds
     */
    public static Clock clock(Map<String, String> environment) {
        Objects.requireNonNull(environment, "environment");
        String v = environment.get(VARIABLE);
        if (v == null || v.isEmpty()) {
            return Clock.systemDefaultZone();
        }
        long seconds;
        try {
            if (!SECONDS.matcher(v).matches()) {
                throw new NumberFormatException(v);
            }
            seconds = Long.parseLong(v);
            return Clock.fixed(Instant.ofEpochSecond(seconds), ZoneOffset.UTC);
        } catch (NumberFormatException | java.time.DateTimeException e) {
            throw new IllegalArgumentException(VARIABLE + " must be a whole number of seconds since"
                    + " 1970-01-01T00:00:00Z, as 'date +%s' prints it, found '" + v + "'; unset it to use today's date");
        }
    }

    /**
     * @param environment the process environment; never null
     * @return today's date by {@link #clock}
     * @throws IllegalArgumentException as {@link #clock}
     */
    public static LocalDate today(Map<String, String> environment) {
        return LocalDate.now(clock(environment));
    }
}
