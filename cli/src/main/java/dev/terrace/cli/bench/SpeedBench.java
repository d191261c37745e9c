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

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The speed benchmark: wall time and peak resident memory of the whole process
 * {@code java -jar terrace.jar propose --batch 4} (JVM start included) on run logs of growing size,
 * made by the virtual chamber (invented data) on the demo campaign's 6 settings, with the launcher's JVM
 * settings ({@code -XX:TieredStopAtLevel=1}, {@code OPENBLAS_NUM_THREADS=1}). Measured with
 * {@code /usr/bin/time -f "%e %M"}; each size runs once after one warm-up of the smallest size.
 *
 * @since 0.1
 */
public final class SpeedBench {

    private SpeedBench() {
    }

    /**
     * @param sizes run-log sizes
     * @param log   progress output
     * @return the table
     * @throws Exception on failures
     */
    public static String run(List<Integer> sizes, PrintWriter log) throws Exception {
        Path jar = selfJar();
        Path dir = Files.createTempDirectory("terrace-speed-");
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%8s %10s %14s %12s%n", "runs", "wall s", "peak RSS MB", "s per run"));
        boolean warm = false;
        for (int n : sizes) {
            Path campaign = makeLog(dir.resolve("n" + n), n);
            if (!warm) {
                measure(jar, campaign);
                warm = true;
            }
            double[] m = measure(jar, campaign);
            sb.append(String.format(Locale.ROOT, "%8d %10.2f %14.0f %12.4f%n", n, m[0], m[1] / 1024, m[0] / n));
            log.flush();
        }
        sb.append("(whole process: JVM start, reading, model fit, GP fits and search; 2-core machine; jar ").append(jar)
                .append(")\n");
        return sb.toString();
    }

    static Path selfJar() throws Exception {
        Path p = Path.of(SpeedBench.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        if (!p.toString().endsWith(".jar")) {
            throw new IllegalStateException("run the speed benchmark from the built jar (./terrace bench --speed)");
        }
        return p;
    }

    static Path makeLog(Path dir, int n) throws IOException {
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

    static double[] measure(Path jar, Path campaign) throws Exception {
        Path timeOut = Files.createTempFile("terrace-time-", ".txt");
        // the same JVM settings as the ./terrace launcher
        ProcessBuilder pb = new ProcessBuilder("/usr/bin/time", "-o", timeOut.toString(), "-f", "%e %M",
                "java", "-XX:TieredStopAtLevel=1", "-Dorg.slf4j.simpleLogger.defaultLogLevel=error", "-jar",
                jar.toString(), "propose",
                campaign.toString(), "--batch", "4", "--format", "csv", "--quiet");
        pb.environment().put("OPENBLAS_NUM_THREADS", "1");
        pb.redirectErrorStream(true);
        pb.redirectOutput(ProcessBuilder.Redirect.DISCARD);
        Process pr = pb.start();
        int rc = pr.waitFor();
        if (rc != 0) {
            throw new IllegalStateException("propose failed with exit code " + rc + " on " + campaign);
        }
        String[] parts = Files.readString(timeOut).trim().split("\\s+");
        Files.deleteIfExists(timeOut);
        return new double[] {Double.parseDouble(parts[parts.length - 2]), Double.parseDouble(parts[parts.length - 1])};
    }
}
