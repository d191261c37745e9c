package dev.terrace.cli.bench;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.demo.DemoCampaign;
import dev.terrace.demo.DemoLogWriter;
import dev.terrace.demo.Recipe;
import dev.terrace.demo.VirtualChamber;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * The speed benchmark: wall time and peak memory of whole processes ({@code java -jar terrace.jar
 * ...}, JVM start included) on run logs of growing size, made by the virtual chamber (invented data)
 * on the demo campaign's 6 settings:
 * <ul>
 *   <li>{@code propose --batch 4} and {@code fit} at each size (default 30, 300, 1000 and 3000 runs);</li>
 *   <li>{@code check} on a log of {@value #CHECK_ROWS} rows, made by repeating the largest chamber log
 *       under new run ids (check's cost depends on the rows, not on their spread).</li>
 * </ul>
 * Each child runs with the launcher's JVM settings ({@code -XX:TieredStopAtLevel=1},
 * {@code OPENBLAS_NUM_THREADS=1}) and a heap cap of {@value #HEAP_CAP} (the memory goal); wall time and
 * peak resident set size of the child come from {@code /usr/bin/time -f "%e %M"}. Each command runs
 * once after one warm-up of the smallest propose. All scratch files live in one temporary folder the
 * benchmark creates and deletes when done.
 *
 * @since 0.1
 */
public final class SpeedBench {

    /** Rows of the log the check measurement reads: the size issue #11 asks check to stay fast on. */
    public static final int CHECK_ROWS = 100_000;

    /** Heap cap of every measured child JVM: the memory goal of issue #11 for a 3000-run proposal. */
    public static final String HEAP_CAP = "2g";

    private SpeedBench() {
    }

    /**
     * @param sizes run-log sizes for propose and fit
     * @param log   progress output
     * @return the table
     * @throws Exception on failures
     */
    public static String run(List<Integer> sizes, PrintWriter log) throws Exception {
        Path jar = selfJar();
        Path dir = Files.createTempDirectory("terrace-speed-");
        try {
            return measureAll(jar, dir, sizes, log);
        } finally {
            deleteTree(dir);
        }
    }

    private static String measureAll(Path jar, Path dir, List<Integer> sizes, PrintWriter log) throws Exception {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%-8s %8s %10s %14s %18s%n", "command", "runs", "wall s",
                "peak RSS MB", "x 30-run propose"));
        Path largest = null;
        Double base = null;
        boolean warm = false;
        for (int n : sizes) {
            Path campaign = makeLog(dir.resolve("n" + n), n);
            largest = campaign;
            if (!warm) {
                measure(jar, dir, campaign, "propose", "--batch", "4", "--format", "csv", "--quiet");
                warm = true;
            }
            double[] p = measure(jar, dir, campaign, "propose", "--batch", "4", "--format", "csv", "--quiet");
            if (n == 30) {
                base = p[0];
            }
            sb.append(row("propose", n, p, base));
            log.flush();
            double[] f = measure(jar, dir, campaign, "fit", "--format", "json", "--quiet");
            sb.append(row("fit", n, f, base));
            log.flush();
        }
        if (largest != null) {
            Path big = repeatLog(largest, dir.resolve("check"), CHECK_ROWS);
            double[] c = measure(jar, dir, big, "check", "--quiet");
            sb.append(row("check", CHECK_ROWS, c, base));
        }
        sb.append("(whole child process: JVM start, reading, fits and search; -Xmx").append(HEAP_CAP)
                .append("; peak RSS of the child by /usr/bin/time; 2-core machine; jar ").append(jar).append(")\n");
        return sb.toString();
    }

    private static String row(String cmd, int n, double[] m, Double base) {
        return String.format(Locale.ROOT, "%-8s %8d %10.2f %14.0f %18s%n", cmd, n, m[0], m[1] / 1024,
                base == null ? "-" : String.format(Locale.ROOT, "%.1f", m[0] / base));
    }

    static Path selfJar() throws Exception {
        Path p = Path.of(SpeedBench.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        if (!p.toString().endsWith(".jar")) {
            throw new IllegalStateException("run the speed benchmark from the built jar (./terrace bench --speed)");
        }
        return p;
    }

    /**
     * Writes the demo campaign and a chamber-made run log of n runs (invented data) into a folder.
     *
     * @param dir the folder (created)
     * @param n   runs
     * @return the campaign file
     * @throws IOException on write failures
     */
    public static Path makeLog(Path dir, int n) throws IOException {
        Files.createDirectories(dir);
        String yaml = DemoCampaign.files().get(DemoCampaign.CAMPAIGN_FILE);
        Path file = dir.resolve("campaign.yaml");
        Files.writeString(file, yaml);
        Campaign c;
        try {
            c = CampaignReader.parse(file, new StringReader(yaml), null).campaign();
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
        DesignSpace space = DesignSpace.of(c);
        List<Recipe> recipes = new ArrayList<>();
        for (DesignPoint p : LatinHypercube.maximinPoints(3 * n, space.dimensions(), space.levelCounts(), 42, 200)) {
            if (space.feasible(p) && recipes.size() < n) {
                recipes.add(new Recipe(space.numbers(p), space.categories(p), ""));
            }
        }
        String csv = DemoLogWriter.write(VirtualChamber.of(c, 42), recipes);
        Files.writeString(c.runs(), csv, StandardCharsets.UTF_8);
        return file;
    }

    /** Copies a campaign into a folder with its run log's data rows repeated under new ids up to {@code rows}. */
    static Path repeatLog(Path campaign, Path dir, int rows) throws IOException {
        Files.createDirectories(dir);
        Path file = dir.resolve("campaign.yaml");
        Files.copy(campaign, file);
        List<String> lines = Files.readAllLines(campaign.resolveSibling("runs.csv"), StandardCharsets.UTF_8);
        List<String> comments = new ArrayList<>();
        String header = null;
        List<String> data = new ArrayList<>();
        for (String l : lines) {
            if (header == null && l.startsWith("#")) {
                comments.add(l);
            } else if (header == null) {
                header = l;
            } else if (!l.isBlank()) {
                data.add(l.substring(l.indexOf(',')));
            }
        }
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("runs.csv"), StandardCharsets.UTF_8)) {
            for (String l : comments) {
                w.write(l);
                w.newLine();
            }
            w.write(header);
            w.newLine();
            for (int i = 0; i < rows; i++) {
                w.write("B" + i + data.get(i % data.size()));
                w.newLine();
            }
        }
        return file;
    }

    static double[] measure(Path jar, Path dir, Path campaign, String... command) throws Exception {
        Path timeOut = Files.createTempFile(dir, "time-", ".txt");
        List<String> cmd = new ArrayList<>(List.of("/usr/bin/time", "-o", timeOut.toString(), "-f", "%e %M",
                "java", "-XX:TieredStopAtLevel=1", "-Xmx" + HEAP_CAP, "-Dorg.slf4j.simpleLogger.defaultLogLevel=error",
                "-jar", jar.toString(), command[0], campaign.toString()));
        cmd.addAll(List.of(command).subList(1, command.length));
        ProcessBuilder pb = new ProcessBuilder(cmd);
        pb.environment().put("OPENBLAS_NUM_THREADS", "1");
        pb.redirectErrorStream(true);
        pb.redirectOutput(ProcessBuilder.Redirect.DISCARD);
        Process pr = pb.start();
        int rc = pr.waitFor();
        if (rc != 0) {
            throw new IllegalStateException(command[0] + " failed with exit code " + rc + " on " + campaign);
        }
        String[] parts = Files.readString(timeOut).trim().split("\\s+");
        Files.deleteIfExists(timeOut);
        return new double[] {Double.parseDouble(parts[parts.length - 2]), Double.parseDouble(parts[parts.length - 1])};
    }

    /** Deletes the benchmark's own temporary folder. */
    private static void deleteTree(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
