package dev.terrace.cli;

import dev.terrace.cli.bench.CalibrationBench;
import dev.terrace.cli.bench.SampleEfficiency;
import dev.terrace.cli.bench.SpeedBench;
import dev.terrace.core.plugins.PluginRegistry;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicInteger;

/** {@code terrace bench}: the sample-efficiency and speed benchmarks, printed as tables. */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = {"Run the benchmarks: evaluations needed on Branin, Hartmann-6 and the virtual chamber",
                "(invented ground truth) against random search and a Latin hypercube, median over seeds;",
                "and with --speed, the time and peak memory of 'propose --batch 4' on growing run logs.",
                "The 'calibration' problem checks the printed yield and 90 %% intervals against the chamber's truth."})
final class BenchCommand implements Callable<Integer> {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Option(names = "--seeds", defaultValue = "20", description = "Seeds per problem and strategy (default: ${DEFAULT-VALUE}).")
    int seeds;

    @Option(names = "--problems", defaultValue = "branin,hartmann6,chamber", split = ",",
            description = "Problems to run (default: ${DEFAULT-VALUE}).")
    List<String> problems;

    @Option(names = "--threads", defaultValue = "2", description = "Worker threads (default: ${DEFAULT-VALUE}).")
    int threads;

    @Option(names = "--speed", description = "Run the speed benchmark instead (whole process, via /usr/bin/time).")
    boolean speed;

    @Option(names = "--sizes", defaultValue = "30,100,300,1000", split = ",",
            description = "Run-log sizes for --speed (default: ${DEFAULT-VALUE}).")
    List<Integer> sizes;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        if (speed) {
            out.print(SpeedBench.run(sizes, out));
            out.flush();
            return 0;
        }
        for (String p : problems) {
            if (!Arrays.asList("branin", "hartmann6", "chamber", "calibration").contains(p)) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "unknown problem '" + p + "'; expected branin, hartmann6, chamber or calibration");
            }
        }
        PluginRegistry reg = Registries.load(global, spec.commandLine().getErr());
        if (problems.contains("calibration")) {
            long c0 = System.nanoTime();
            CalibrationBench.Result cal;
            try (Progress bar = Progress.start("calibration", seeds, global)) {
                AtomicInteger seen = new AtomicInteger();
                cal = new CalibrationBench(seeds, threads, k -> {
                    synchronized (bar) {
                        bar.stepTo(seen.addAndGet(k));
                    }
                }).run(reg);
            }
            out.print(CalibrationBench.table(cal));
            out.printf(java.util.Locale.ROOT, "(%.0f s on %d threads)%n%n", (System.nanoTime() - c0) / 1e9, threads);
            out.flush();
            problems = problems.stream().filter(p -> !p.equals("calibration")).toList();
            if (problems.isEmpty()) {
                return 0;
            }
        }
        AtomicInteger done = new AtomicInteger();
        SampleEfficiency se0 = new SampleEfficiency(seeds, threads, k -> { });
        long t0 = System.nanoTime();
        List<SampleEfficiency.Trial> trials;
        try (Progress bar = Progress.start("bench", se0.trialCount(problems), global)) {
            SampleEfficiency se = new SampleEfficiency(seeds, threads, k -> {
                synchronized (bar) {
                    bar.stepTo(done.addAndGet(k));
                }
            });
            trials = se.run(problems, reg);
        }
        out.print(SampleEfficiency.table(trials));
        out.printf(java.util.Locale.ROOT, "(%d trials, %.0f s on %d threads)%n", trials.size(),
                (System.nanoTime() - t0) / 1e9, threads);
        out.flush();
        return 0;
    }
}
