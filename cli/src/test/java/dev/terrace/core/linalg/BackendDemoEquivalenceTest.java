package dev.terrace.core.linalg;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The demo campaign (invented data) gives the same proposals with the pure-Java linear algebra as
 * with native OpenBLAS: the reference is the native LAPACK (OpenBLAS 0.3.26 through Smile 3.1.1),
 * the tolerance 1e-6 on every recipe setting, yield and acquisition value, and 1e-6 relative on
 * the outcome predictions (densities are of order 1e9 per cm², so an absolute 1e-6 would ask for
 * 15 significant digits, beyond what two correct Cholesky codes share).
 */
class BackendDemoEquivalenceTest {

    static final double TOLERANCE = 1e-6;

    @Test
    void pureJavaProposesWhatNativeProposesOnTheDemo(@TempDir Path tmp) throws Exception {
        DenseAlgebra nat = Algebra.nativeIfAvailable();
        Assumptions.assumeTrue(nat != null, "no native BLAS on this machine: nothing to compare with");
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        PluginRegistry reg = PluginRegistry.builder().build();
        ProposalSet a;
        ProposalSet b;
        try (AutoCloseable h = Algebra.use(nat)) {
            a = Proposer.propose(LoadedCampaign.open(campaign, reg), reg, ProposeSettings.defaults());
        }
        try (AutoCloseable h = Algebra.use(Algebra.java())) {
            b = Proposer.propose(LoadedCampaign.open(campaign, reg), reg, ProposeSettings.defaults());
        }
        assertEquals(a.mode(), b.mode());
        assertEquals(a.notes(), b.notes());
        assertEquals(a.proposals().size(), b.proposals().size());
        for (int i = 0; i < a.proposals().size(); i++) {
            Proposal p = a.proposals().get(i);
            Proposal q = b.proposals().get(i);
            String at = "proposal " + (i + 1);
            assertEquals(p.recipe().keySet(), q.recipe().keySet(), at);
            for (Map.Entry<String, Object> e : p.recipe().entrySet()) {
                Object o = q.recipe().get(e.getKey());
                if (e.getValue() instanceof Number n) {
                    assertEquals(n.doubleValue(), ((Number) o).doubleValue(), TOLERANCE, at + " " + e.getKey());
                } else {
                    assertEquals(e.getValue(), o, at + " " + e.getKey());
                }
            }
            assertEquals(p.yield(), q.yield(), TOLERANCE, at + " yield");
            assertEquals(p.acquisition(), q.acquisition(), TOLERANCE, at + " acquisition");
            assertEquals(p.success(), q.success(), TOLERANCE, at + " success");
            assertEquals(p.numeric().keySet(), q.numeric().keySet(), at);
            for (Map.Entry<String, NumericPrediction> e : p.numeric().entrySet()) {
                NumericPrediction u = e.getValue();
                NumericPrediction v = q.numeric().get(e.getKey());
                assertClose(u.mean(), v.mean(), at + " " + e.getKey() + " mean");
                assertClose(u.sd(), v.sd(), at + " " + e.getKey() + " sd");
                assertClose(u.lo90(), v.lo90(), at + " " + e.getKey() + " lo90");
                assertClose(u.hi90(), v.hi90(), at + " " + e.getKey() + " hi90");
                assertEquals(u.inWindow(), v.inWindow(), TOLERANCE, at + " " + e.getKey() + " in window");
            }
        }
    }

    static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, TOLERANCE * Math.max(1, Math.abs(expected)), what);
    }
}
