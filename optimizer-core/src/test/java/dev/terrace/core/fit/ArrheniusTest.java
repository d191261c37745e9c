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
        // doi 10.1063/1.4721663. The reference file derives E_eff = 0.211 eV, i.e. E_d = 0.74 eV for
        // 3D islands with i = 1 and 0.63 eV for 2D islands with i = 1 (values derived, not printed in the paper).
        Arrhenius a = Arrhenius.fit(new double[] {403.15, 473.15}, new double[] {2.7e11, 1.1e11});
        assertEquals(0.211, a.energyEv(), 0.0015);
        assertEquals(0.74, a.impliedDiffusionBarrier(1, 2.5, 0), 0.006);
        assertEquals(0.63, a.impliedDiffusionBarrier(1, 2.0, 0), 0.005);
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
