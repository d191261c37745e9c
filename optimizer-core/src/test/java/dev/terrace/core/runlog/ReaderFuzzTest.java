package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Mutation fuzzing of the two readers a grower's files go through. Valid files (the bundled
 * campaign template and a run log for the invented test campaign of {@link RunLogFixtures}) are
 * damaged in the ways files get damaged in a lab: cut short by a full disk, bytes flipped, saved
 * by a spreadsheet in another encoding (UTF-16 with or without BOM, Latin-1, UTF-8 with BOM),
 * values of the wrong type, huge or non-finite numbers, control characters, deep nesting,
 * duplicated keys and lines. Every mutant must either load or fail with the reader's own
 * {@link InputException} whose errors carry a line (1-based); any other exception, or an error
 * diagnostic without a line, fails the test and prints the mutant.
 *
 * <p>Whole-file problems may carry line 0, as {@link Diagnostic} documents: an empty file, and a
 * campaign file that is not UTF-8 (the campaign's file-opening step reports that for the whole
 * file). The seed is fixed, so a failure reproduces; the case number in the message identifies it.
 */
class ReaderFuzzTest {

    /** Mutants per reader; 2 x 5000 = 10^4 files in all (the brief asks for at least 10^4). */
    private static final int CASES_PER_READER = 5000;
    /** Fixed seed: a failure reproduces exactly. */
    private static final long SEED = 20261203L;

    /** Whole-file diagnostics that legitimately carry line 0 (see the class comment). */
    private static final List<String> WHOLE_FILE_MESSAGES = List.of(
            "the campaign file is empty", "campaign file is not UTF-8 text", "campaign file could not be read");

    private static final String[] HUGE = {"1e400", "-1e400", "1e-400", "99999999999999999999999999999999",
            "NaN", ".nan", "-.inf", "Infinity", "0x1F", "1_000", "-0", "+.5e+", "1e", "١٢٣", "1,5", "2147483648",
            "9".repeat(5000), "0." + "0".repeat(400) + "1"};
    private static final String[] WRONG_TYPES = {"[1, 2]", "{a: 1}", "~", "null", "true", "\"text\"", "!!binary aGk=",
            "&a x", "*a", "!!float abc", "[", "{", "? complex\n: key", "|\n  block", ">-", "- item", "''", "@", "`",
            "%TAG ! tag:x,2000:", "!<tag:yaml.org,2002:str> x"};
    private static final String[] CONTROL = {"\u0000", "\u0001", "\u0007", "\u001b", "\u007f", "\u0085", "\u2028",
            "\u2029", "\ufeff", "\ufffe", "\ud800", "\udc00", "\t", "\r", "\u00a0", "\u200b", "\"", ",", ":", "#", "\n"};
    private static final Charset[] CHARSETS = {StandardCharsets.UTF_16LE, StandardCharsets.UTF_16BE,
            StandardCharsets.UTF_16, StandardCharsets.ISO_8859_1, Charset.forName("UTF-32"), Charset.forName("windows-1252")};

    @TempDir
    Path dir;

    @Test
    void mutatedCampaignFilesLoadOrFailWithAPosition() throws IOException {
        String valid = resource("/dev/terrace/core/campaign-template.yaml");
        Random rnd = new Random(SEED);
        Path file = dir.resolve("campaign.yaml");
        int loaded = 0;
        Map<String, String> failures = new LinkedHashMap<>();
        for (int n = 0; n < CASES_PER_READER; n++) {
            byte[] bytes = mutate(valid, rnd, true);
            Files.write(file, bytes);
            try {
                CampaignReader.Result r = CampaignReader.read(file, Set.of("island-nucleation", "droplet-crystallization"));
                assertNotNull(r.campaign(), "case " + n);
                loaded++;
            } catch (InputException e) {
                checkPositions("campaign case " + n, e, bytes, failures);
            } catch (RuntimeException | StackOverflowError | IOException e) {
                failures.putIfAbsent(e.getClass().getName(), "campaign case " + n + " raised " + e + " for:\n" + shown(bytes));
            }
        }
        report(failures);
        // The mutations are not so harsh that nothing survives, nor so mild that everything does.
        assertFalse(loaded == 0 || loaded == CASES_PER_READER, "loaded " + loaded + " of " + CASES_PER_READER);
    }

    @Test
    void mutatedRunLogsLoadOrFailWithAPosition() throws IOException {
        String valid = String.join("\n",
                "# invented test run log (see RunLogFixtures)",
                RunLogFixtures.FULL_HEADER,
                "D-001,150,0.1,1.5,1e-5,As4,10,2.3e9,45,dot,0.8,ok,2024-03-04,,\"first run, \"\"baseline\"\" recipe\"",
                "D-002,180,0.05,2,<1e-7,As2,0,>1e10,30.5,ring,,ok,2024-03-05,P-3,",
                "D-003,210,0.2,1,3.2e-6,As4,5,,,,,failed,2024-03-06,,\"shutter stuck\"",
                "D-004,250,0.5,3,1e-4,As2,30,8e8,60,hole,1.2,ok,2024-03-07,,", "");
        Campaign campaign = RunLogFixtures.campaign();
        Random rnd = new Random(SEED + 1);
        Path file = dir.resolve("runs.csv");
        int loaded = 0;
        Map<String, String> failures = new LinkedHashMap<>();
        for (int n = 0; n < CASES_PER_READER; n++) {
            byte[] bytes = mutate(valid, rnd, false);
            Files.write(file, bytes);
            try {
                RunLog log = RunLogReader.read(campaign, file);
                assertNotNull(log.runs(), "case " + n);
                loaded++;
            } catch (InputException e) {
                checkPositions("run-log case " + n, e, bytes, failures);
            } catch (RuntimeException | StackOverflowError | IOException e) {
                failures.putIfAbsent(e.getClass().getName(), "run-log case " + n + " raised " + e + " for:\n" + shown(bytes));
            }
        }
        report(failures);
        assertFalse(loaded == 0 || loaded == CASES_PER_READER, "loaded " + loaded + " of " + CASES_PER_READER);
    }

    @Test
    void theUnmutatedFilesLoad() throws Exception {
        // Control: the fuzz inputs start from files that the readers accept.
        Path c = dir.resolve("campaign.yaml");
        Files.writeString(c, resource("/dev/terrace/core/campaign-template.yaml"));
        assertEquals(6, CampaignReader.read(c, null).campaign().parameters().size());
        Path r = dir.resolve("runs.csv");
        Files.writeString(r, RunLogFixtures.FULL_HEADER + "\nD-001,150,0.1,1.5,1e-5,As4,10,2.3e9,45,dot,0.8,ok,2024-03-04,,\n");
        assertEquals(1, RunLogReader.read(RunLogFixtures.campaign(), r).runs().size());
    }

    /** Records each kind of failure once (by exception class or message start) with its first mutant. */
    private static void checkPositions(String what, InputException e, byte[] bytes, Map<String, String> failures) {
        List<Diagnostic> errors = e.diagnostics().stream().filter(Diagnostic::isError).toList();
        if (errors.isEmpty()) {
            failures.putIfAbsent("no error", what + ": InputException without an error diagnostic for:\n" + shown(bytes));
        }
        for (Diagnostic d : errors) {
            boolean wholeFile = WHOLE_FILE_MESSAGES.stream().anyMatch(d.message()::startsWith);
            if (d.line() < 1 && !wholeFile) {
                String key = d.message().substring(0, Math.min(40, d.message().length()));
                failures.putIfAbsent(key, what + ": error without a line: " + d + "\nfor:\n" + shown(bytes));
            }
            if (d.message().isBlank()) {
                failures.putIfAbsent("blank", what + ": blank message at line " + d.line() + " for:\n" + shown(bytes));
            }
        }
    }

    private static void report(Map<String, String> failures) {
        if (!failures.isEmpty()) {
            fail(failures.size() + " kinds of failure; the first mutant of each:\n\n"
                    + String.join("\n\n----------\n", failures.values()));
        }
    }

    // ------------------------------------------------------------------ mutations

    /** One to three text mutations, then possibly a re-encoding or byte-level damage. */
    private static byte[] mutate(String valid, Random rnd, boolean yaml) {
        String text = valid;
        int rounds = 1 + rnd.nextInt(3);
        for (int k = 0; k < rounds; k++) {
            text = mutateText(text, rnd, yaml);
        }
        byte[] bytes;
        int enc = rnd.nextInt(10);
        if (enc == 0) {
            bytes = text.getBytes(CHARSETS[rnd.nextInt(CHARSETS.length)]);
        } else if (enc == 1) {
            bytes = concat(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, text.getBytes(StandardCharsets.UTF_8));
        } else {
            bytes = text.getBytes(StandardCharsets.UTF_8);
        }
        int bin = rnd.nextInt(8);
        if (bin == 0 && bytes.length > 0) {
            int flips = 1 + rnd.nextInt(6);
            for (int k = 0; k < flips; k++) {
                int p = rnd.nextInt(bytes.length);
                bytes[p] = (byte) (bytes[p] ^ (1 << rnd.nextInt(8)));
            }
        } else if (bin == 1) {
            bytes = java.util.Arrays.copyOf(bytes, rnd.nextInt(bytes.length + 1)); // cut short mid-character
        } else if (bin == 2 && bytes.length > 0) {
            bytes[rnd.nextInt(bytes.length)] = (byte) (0x80 + rnd.nextInt(0x80)); // stray high byte
        }
        return bytes;
    }

    private static String mutateText(String t, Random rnd, boolean yaml) {
        int len = t.length();
        int p = len == 0 ? 0 : rnd.nextInt(len + 1);
        switch (rnd.nextInt(14)) {
            case 0: // truncation
                return t.substring(0, p);
            case 1: // a number replaced by a huge, tiny or malformed one
                return replaceToken(t, rnd, "[-+]?\\d[\\d.eE+-]*", HUGE[rnd.nextInt(HUGE.length)]);
            case 2: // a value replaced by one of the wrong type
                return yaml ? replaceToken(t, rnd, "(?<=: )[^\\s,{}\\[\\]#]+", WRONG_TYPES[rnd.nextInt(WRONG_TYPES.length)])
                        : replaceToken(t, rnd, "(?<=,)[^,\\n]*", WRONG_TYPES[rnd.nextInt(WRONG_TYPES.length)]);
            case 3: // control or structural characters inserted
                return t.substring(0, p) + CONTROL[rnd.nextInt(CONTROL.length)] + t.substring(p);
            case 4: // a line duplicated (duplicate keys in YAML, duplicate run ids in CSV)
                return duplicateLine(t, rnd);
            case 5: // a line deleted
                return deleteLine(t, rnd);
            case 6: // deep nesting
                int depth = 1 + rnd.nextInt(rnd.nextBoolean() ? 60 : 2_000);
                String open = yaml ? (rnd.nextBoolean() ? "[" : "{a: ") : "\"";
                String close = yaml ? (open.equals("[") ? "]" : "}") : "\"";
                return t.substring(0, p) + open.repeat(depth) + "1" + close.repeat(rnd.nextInt(depth + 1)) + t.substring(p);
            case 7: // a very long line
                return t.substring(0, p) + "x".repeat(1000 + rnd.nextInt(5_000)) + t.substring(p);
            case 8: // line endings changed
                return rnd.nextBoolean() ? t.replace("\n", "\r") : t.replace("\n", "\r\n");
            case 9: // a random piece of the file pasted elsewhere
                int a = rnd.nextInt(len + 1);
                int b = Math.min(len, a + rnd.nextInt(200));
                return t.substring(0, p) + t.substring(a, b) + t.substring(p);
            case 10: // non-ASCII text, as a spreadsheet in another locale writes it
                return t.substring(0, p) + (rnd.nextBoolean() ? "°C µm Å é ü ß" : "温度 😀") + t.substring(p);
            case 11: // YAML aliases (expansion bomb) or CSV quote games
                return yaml ? "a: &a [x, x, x, x, x, x, x, x]\nb: &b [*a, *a, *a, *a, *a, *a, *a, *a]\nc: [*b, *b, *b, *b]\n" + t
                        : t.substring(0, p) + (rnd.nextBoolean() ? "\"" : "\"\"\"") + t.substring(p);
            case 12: // indentation with tabs, or a key duplicated inside a flow mapping
                return yaml ? (rnd.nextBoolean() ? t.replace("  ", "\t") : t.replaceFirst("\\{unit: ", "{unit: ML, unit: "))
                        : t.replace(",", rnd.nextBoolean() ? ";" : ",,");
            default: // empty or whitespace-only
                return rnd.nextBoolean() ? "" : " \n\t\n";
        }
    }

    private static String replaceToken(String t, Random rnd, String regex, String with) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile(regex).matcher(t);
        List<int[]> spans = new ArrayList<>();
        while (m.find()) {
            spans.add(new int[] {m.start(), m.end()});
        }
        if (spans.isEmpty()) {
            return t;
        }
        int[] s = spans.get(rnd.nextInt(spans.size()));
        return t.substring(0, s[0]) + with + t.substring(s[1]);
    }

    private static String duplicateLine(String t, Random rnd) {
        List<String> lines = new ArrayList<>(List.of(t.split("\n", -1)));
        int i = rnd.nextInt(lines.size());
        lines.add(Math.min(lines.size(), i + 1 + rnd.nextInt(3)), lines.get(i));
        return String.join("\n", lines);
    }

    private static String deleteLine(String t, Random rnd) {
        List<String> lines = new ArrayList<>(List.of(t.split("\n", -1)));
        lines.remove(rnd.nextInt(lines.size()));
        return String.join("\n", lines);
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] out = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    private static String shown(byte[] bytes) {
        String s = new String(bytes, StandardCharsets.UTF_8);
        return s.length() > 3000 ? s.substring(0, 3000) + "... (" + s.length() + " chars)" : s;
    }

    private static String resource(String name) throws IOException {
        try (InputStream in = CampaignReader.class.getResourceAsStream(name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
