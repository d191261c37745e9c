package dev.terrace.cli.bench;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.ProposalSet;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

/**
 * JMH benchmark of the in-process parts of {@code terrace propose --batch 4} on run logs made by the
 * virtual chamber (invented data) for the demo campaign: fitting the surrogates, and the search
 * given fitted surrogates. Not a unit test: run it as described in DEVELOPERS.md ("Benchmarks").
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 3)
@Fork(value = 1, jvmArgsAppend = {"-Dorg.slf4j.simpleLogger.defaultLogLevel=error"})
public class ProposeBenchmark {

    /** Run-log size. */
    @Param({"30", "100", "300"})
    public int runs;

    private LoadedCampaign lc;
    private PluginRegistry reg;
    private CampaignSurrogate sur;

    /** Writes the run log and fits once for the search benchmark. */
    @Setup(Level.Trial)
    public void setUp() throws Exception {
        Path dir = Files.createTempDirectory("terrace-jmh-");
        Path campaign = SpeedBench.makeLog(dir.resolve("n" + runs), runs);
        reg = PluginRegistry.builder().build();
        lc = LoadedCampaign.open(campaign, reg);
        sur = CampaignSurrogate.build(lc, reg, true, 7);
    }

    /** @return the fitted surrogates (growth models, GPs, classifier, success model) */
    @Benchmark
    public CampaignSurrogate fitSurrogates() {
        return CampaignSurrogate.build(lc, reg, true, 7);
    }

    /** @return a batch of 4 proposals from already fitted surrogates */
    @Benchmark
    public ProposalSet searchBatchOf4() {
        return Proposer.propose(sur, ProposeSettings.defaults().withBatch(4));
    }
}
