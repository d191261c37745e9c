package dev.terrace.core.linalg;

import java.util.Locale;
import java.util.Objects;

/**
 * Chooses the {@link DenseAlgebra} of this process, once, on first use.
 *
 * <p>The choice is read from the system property {@value #PROPERTY}, else from the environment
 * variable {@value #ENVIRONMENT}, else {@code auto}:
 * <ul>
 *   <li>{@code auto}: native when OpenBLAS loads and passes a small check, otherwise pure Java;</li>
 *   <li>{@code native}: native; when it does not load, pure Java with the reason stated in
 *       {@link #description()};</li>
 *   <li>{@code java}: pure Java, without touching the native library (nothing is unpacked into
 *       the javacpp cache).</li>
 * </ul>
 * Any other value is refused with an {@link IllegalArgumentException} naming the accepted ones.
 *
 * @since 0.1
 */
public final class Algebra {

    /** System property that selects the backend: {@code auto}, {@code native} or {@code java}. */
    public static final String PROPERTY = "terrace.algebra";

    /** Environment variable read when the property is not set; same values. */
    public static final String ENVIRONMENT = "TERRACE_ALGEBRA";

    private static volatile Choice chosen;
    private static volatile DenseAlgebra override;

    private Algebra() {
    }

    /**
     * The backend chosen and why.
     *
     * @param algebra the backend
     * @param reason  how it was chosen, for {@code --version}; never blank
     */
    public record Choice(DenseAlgebra algebra, String reason) {
        /** Checks the fields. */
        public Choice {
            Objects.requireNonNull(algebra, "algebra");
            if (reason == null || reason.isBlank()) {
                throw new IllegalArgumentException("reason must not be blank");
            }
        }
    }

    /** @return the backend in use; never null */
    public static DenseAlgebra current() {
        DenseAlgebra o = override;
        return o != null ? o : choice().algebra();
    }

    /** @return one line naming the backend in use and how it was chosen */
    public static String description() {
        DenseAlgebra o = override;
        if (o != null) {
            return o.name() + " (set in process)";
        }
        Choice c = choice();
        return c.algebra().name() + " (" + c.reason() + ")";
    }

    /** @return the pure-Java backend; never null */
    public static DenseAlgebra java() {
        return JavaAlgebra.INSTANCE;
    }

    /**
     * @return the native backend when it loads on this machine, else null
     */
    public static DenseAlgebra nativeIfAvailable() {
        return nativeFailure() == null ? NativeAlgebra.INSTANCE : null;
    }

    /**
     * Uses the given backend in this process until the returned handle is closed, overriding the
     * configured choice (for tests and benchmarks that compare backends in one JVM; not for
     * concurrent use with different backends).
     *
     * @param algebra the backend
     * @return a handle whose {@code close} restores the configured choice
     */
    public static AutoCloseable use(DenseAlgebra algebra) {
        Objects.requireNonNull(algebra, "algebra");
        DenseAlgebra before = override;
        override = algebra;
        return () -> override = before;
    }

    /**
     * Checks the configured request without choosing a backend, so that a front end can refuse a
     * misspelt value before any work starts.
     *
     * @return null when {@value #PROPERTY} and {@value #ENVIRONMENT} hold accepted values (or are
     *         unset), else a message naming the value and the accepted ones
     */
    public static String configurationProblem() {
        String prop = System.getProperty(PROPERTY);
        try {
            parse(prop != null ? prop : System.getenv(ENVIRONMENT));
            return null;
        } catch (IllegalArgumentException e) {
            return e.getMessage();
        }
    }

    /**
     * Parses a backend request.
     *
     * @param value the property or environment value; null or blank means {@code auto}
     * @return {@code auto}, {@code native} or {@code java}
     * @throws IllegalArgumentException for any other value
     */
    static String parse(String value) {
        if (value == null || value.isBlank()) {
            return "auto";
        }
        String v = value.trim().toLowerCase(Locale.ROOT);
        if (v.equals("auto") || v.equals("native") || v.equals("java")) {
            return v;
        }
        throw new IllegalArgumentException("linear-algebra backend '" + value.trim() + "' is not known (from "
                + PROPERTY + " or " + ENVIRONMENT + "); expected auto, native or java");
    }

    private static Choice choice() {
        Choice c = chosen;
        if (c == null) {
            synchronized (Algebra.class) {
                c = chosen;
                if (c == null) {
                    c = decide();
                    chosen = c;
                }
            }
        }
        return c;
    }

    private static Choice decide() {
        String prop = System.getProperty(PROPERTY);
        String source = prop != null ? PROPERTY : ENVIRONMENT;
        String request = parse(prop != null ? prop : System.getenv(ENVIRONMENT));
        if (request.equals("java")) {
            return new Choice(JavaAlgebra.INSTANCE, "chosen by " + source + "=java");
        }
        String failure = nativeFailure();
        if (failure == null) {
            return new Choice(NativeAlgebra.INSTANCE, request.equals("native") ? "chosen by " + source + "=native"
                    : "native library loaded");
        }
        return new Choice(JavaAlgebra.INSTANCE, (request.equals("native") ? source + "=native asked for it, but the "
                : "the ") + "native library is not usable here: " + failure);
    }

    private static volatile String probe;

    /** @return null when the native backend works, else a one-line reason */
    private static String nativeFailure() {
        String p = probe;
        if (p == null) {
            synchronized (Algebra.class) {
                p = probe;
                if (p == null) {
                    p = runProbe();
                    probe = p;
                }
            }
        }
        return p.isEmpty() ? null : p;
    }

    /** Factorises a 2×2 matrix with a known factor; "" on success. */
    private static String runProbe() {
        try {
            double[] a = {4, 2, 2, 5};
            boolean ok = NativeAlgebra.INSTANCE.cholesky(2, a);
            // [[4, 2], [2, 5]] = L Lᵀ with L = [[2, 0], [1, 2]]
            if (ok && a[0] == 2 && a[1] == 1 && a[3] == 2) {
                return "";
            }
            return "the native Cholesky gave a wrong result on a 2x2 check";
        } catch (LinkageError | RuntimeException e) {
            String m = e.getMessage();
            return e.getClass().getSimpleName() + (m == null ? "" : ": " + firstLine(m));
        }
    }

    private static String firstLine(String s) {
        int i = s.indexOf('\n');
        String t = i < 0 ? s : s.substring(0, i);
        return t.length() > 160 ? t.substring(0, 160) + "..." : t;
    }
}
