package dev.terrace.core.fit;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class ArrheniusTest {

    @Test
    void publishedTwoPointDropletDensitiesGiveTheStatedActivationEnergy() {
        // GaAs droplet-epitaxy dot densities 2.7e11 cm^-2 at 130 degC and 1.1e11 cm^-2 at 200 degC (5 ML),
        // "Extremely high-density GaAs quantum dots grown by droplet epitaxy", Appl. Phys. Lett. 100 (21) (2012),
        // doi 10.1063/1.4721663 (densities read in the figure captions). Derivation (not printed in the
        // paper), with k = 8.617333262e-5 eV/K (CODATA 2018):
        //   E_eff = k ln(2.7/1.1) / (1/403.15 - 1/473.15) = 8.617333e-5 * 0.897942 / 3.669717e-4
        //         = 0.210857 eV.
        // Venables' Arrhenius energy for complete condensation, E = (E_i + i E_d)/(i + p) with p = 2
        // (2D islands) or 2.5 (3D islands), E_1 = 0 (Venables, Spiller, Hanbuecken, Rep. Prog. Phys. 47,
        // 399 (1984); form from memory), gives for i = 1: E_d = 3.5 E = 0.738000 eV (3D) and
        // E_d = 3 E = 0.632572 eV (2D).
        Arrhenius a = Arrhenius.fit(new double[] {403.15, 473.15}, new double[] {2.7e11, 1.1e11});
        assertEquals(0.210857, a.energyEv(), 1e-5 * 0.210857);
        assertEquals(0.738000, a.impliedDiffusionBarrier(1, 2.5, 0), 1e-5 * 0.738);
        assertEquals(0.632572, a.impliedDiffusionBarrier(1, 2.0, 0), 1e-5 * 0.632572);
        // consistent with the Ga diffusion barrier 0.7 +- 0.1 eV of Wang et al., Chin. Phys. B 29, 046801 (2020)
        double ed = a.impliedDiffusionBarrier(1, 2.5, 0);
        assertEquals(0.7, ed, 0.1);
    }

    @Test
    void intervalMatchesCommonsMathRegressionOnNoisyData() {
        double[] t = {420, 440, 460, 480, 500, 520, 540};
        double[] n = new double[t.length];
        double[] noise = {0.05, -0.08, 0.02, 0.07, -0.04, -0.03, 0.06};
        for (int i = 0; i < t.length; i++) {
            n[i] = 1e10 * Math.exp(0.2 / (Arrhenius.BOLTZMANN_EV_PER_K * t[i]) + noise[i]);
        }
        Arrhenius a = Arrhenius.fit(t, n);
        SimpleRegression ref = new SimpleRegression();
        for (int i = 0; i < t.length; i++) {
            ref.addData(1 / (Arrhenius.BOLTZMANN_EV_PER_K * t[i]), Math.log(n[i]));
        }
        // reference library: Apache Commons Math SimpleRegression slope and its 95 % half-width
        assertEquals(ref.getSlope(), a.energyEv(), 1e-12);
        assertEquals(ref.getSlopeConfidenceInterval(0.05), (a.hi() - a.lo()) / 2, 1e-10);
    }

    @Test
    void rejectsDegenerateInput() {
        assertThrows(IllegalArgumentException.class, () -> Arrhenius.fit(new double[] {500}, new double[] {1}));
        assertThrows(IllegalArgumentException.class,
                () -> Arrhenius.fit(new double[] {500, 500}, new double[] {1, 2}));
        assertThrows(IllegalArgumentException.class,
                () -> Arrhenius.fit(new double[] {500, 600}, new double[] {1, -2}));
    }
}
