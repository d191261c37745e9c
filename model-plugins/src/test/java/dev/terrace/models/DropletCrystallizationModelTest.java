package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.contract.GrowthModelContractTest;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Contract cases plus published regime checks for {@link DropletCrystallizationModel}. Each check value
 * names its primary source beside it and shows the arithmetic of any derived number. Group-V fluxes are converted from flux-gauge readings with {@link RoughBeamFlux}.
 */
class DropletCrystallizationModelTest extends GrowthModelContractTest {

    private static final Surface GAAS_GA = IslandNucleationModelTest.GAAS_GA;
    private static final Surface GAAS_IN = IslandNucleationModelTest.GAAS_IN;
    private static final double CELSIUS = 273.15;

    private final DropletCrystallizationModel model = new DropletCrystallizationModel();
    private final ParameterValues defaults = ParameterValues.defaults(model.parameters());

    @Override
    protected GrowthModel model() {
        return new DropletCrystallizationModel();
    }

    @Override
    protected Conditions typicalConditions() {
        // Ga droplets, 1 ML at 1e9 cm^-2, crystallised at 150 °C under 1e-5 Torr As4 (invented typical recipe
        // in the compact-dot range of low-temperature droplet epitaxy, Watanabe, Koguchi, Gotoh, JJAP 39, L79 (2000),
        // citation from memory).
        return recipe(150, 1.0, 1e9, RoughBeamFlux.atomFlux(1e-5, "As4"), "As4");
    }

    @Override
    protected Surface typicalSurface() {
        return GAAS_GA;
    }

    private static Conditions recipe(double celsius, double coverage, double density, double flux, String species) {
        return Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, celsius + CELSIUS)
                .set(Role.COVERAGE, coverage).set(Role.ISLAND_DENSITY, density).set(Role.GROUP_V_FLUX, flux)
                .set(Role.GROUP_V_SPECIES, species).build();
    }

    private static String mostLikely(Prediction p) {
        return p.classProbabilities(Role.MORPHOLOGY).entrySet().stream().max(Map.Entry.comparingByValue())
                .orElseThrow().getKey();
    }

    @Test
    void lowTemperatureHighArsenicFluxGivesDots() {
        // compact dots at 150 °C under 1e-4 Torr As4 BEP: Watanabe, Koguchi, Gotoh, JJAP 39, L79 (2000) (from memory);
        // "modified droplet epitaxy" with high As flux at low substrate temperature, JJAP Part 2 (2000). Droplets:
        // 2 ML at 1e8 cm^-2 and 1 ML at 1e10 cm^-2 (hemisphere radii 48.4 and 8.3 nm; see deepDotDiameter... below).
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        for (double[] droplet : new double[][] {{2, 1e8}, {1, 1e10}}) {
            Prediction p = model.predict(recipe(150, droplet[0], droplet[1], flux, "As4"), GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertEquals(DropletCrystallizationModel.DOT, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
            assertTrue(p.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT) > 0.9);
        }
    }

    @Test
    void hotSubstrateWithArsenicBelow1e7TorrGivesHoles() {
        // local droplet etching at 570-620 °C with the As reading below 1e-7 Torr: Heyn et al., Nanoscale Res. Lett.
        // 9, 285 (2014) (citation from memory; the temperatures were read in the paper). 1e-8 Torr As4, and the
        // valve closed.
        for (double flux : new double[] {RoughBeamFlux.atomFlux(1e-8, "As4"), 0.0}) {
            Prediction p = model.predict(recipe(620, 2.0, 1e8, flux, "As4"), GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertEquals(DropletCrystallizationModel.HOLE, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
            assertTrue(p.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.HOLE) > 0.9);
        }
    }

    @Test
    void intermediateTemperatureAndFluxGivesRings() {
        // rings at intermediate T (200-400 °C) and lower As flux (1e-7 to 1e-5 Torr): Mano et al., Nano Lett. 5, 425
        // (2005); Somaschini et al., Nanoscale Res. Lett. 5, 1865 (2010) (windows as read in those papers' abstracts).
        // 300 °C, 1e-6 Torr As4, droplets of 1 ML at 1e9 and 2 ML at 1e8 cm^-2 (radii 17.8 and 48.4 nm).
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        for (double[] droplet : new double[][] {{1, 1e9}, {2, 1e8}}) {
            Prediction p = model.predict(recipe(300, droplet[0], droplet[1], flux, "As4"), GAAS_GA, defaults);
            assertEquals(DropletCrystallizationModel.RING, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
        }
    }

    @Test
    void etchingNeedsBothHighTemperatureAndLowFlux() {
        // the hole regime depends on the As flux, not only on T: Zhou, Zheng, Tang, Jesson, Tersoff, "Congruent
        // evaporation temperature of GaAs(001) controlled by As flux", Appl. Phys. Lett. (2010) (volume and page
        // not recorded)
        Prediction hotWithArsenic = model.predict(recipe(620, 2.0, 1e8, RoughBeamFlux.atomFlux(1e-5, "As4"), "As4"),
                GAAS_GA, defaults);
        assertNotEquals(DropletCrystallizationModel.HOLE, mostLikely(hotWithArsenic));
        Prediction coolWithout = model.predict(recipe(300, 2.0, 1e8, RoughBeamFlux.atomFlux(1e-8, "As4"), "As4"),
                GAAS_GA, defaults);
        assertTrue(coolWithout.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.HOLE) < 0.01);
    }

    @Test
    void featureDiameterNeverShrinksAsCrystallisationTemperatureRises() {
        // ring and outer-disk diameters grow with crystallisation T at fixed As flux: Mano et al. 2005; Somaschini
        // et al. 2010 (Arrhenius growth of the Ga diffusion area)
        for (double bep : new double[] {1e-4, 1e-6, 1e-8}) {
            double flux = RoughBeamFlux.atomFlux(bep, "As4");
            double previous = 0;
            for (double c = 30; c <= 700; c += 5) {
                Prediction p = model.predict(recipe(c, 2.0, 1e8, flux, "As4"), GAAS_GA, defaults);
                double d = p.value(Role.ISLAND_DIAMETER).orElseThrow();
                assertTrue(d >= previous, "diameter fell at " + c + " °C and " + bep + " Torr: " + d + " < " + previous);
                previous = d;
            }
        }
    }

    @Test
    void ringDiameterGrowsBetween200And400Celsius() {
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        double d200 = model.predict(recipe(200, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .value(Role.ISLAND_DIAMETER).orElseThrow();
        double d400 = model.predict(recipe(400, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .value(Role.ISLAND_DIAMETER).orElseThrow();
        assertTrue(d400 > 1.2 * d200, d200 + " nm at 200 °C, " + d400 + " nm at 400 °C");
    }

    @Test
    void deepDotDiameterIsTheHemisphereDropletDiameter() {
        // hemisphere diameters d = 2 (3V/(2 pi))^(1/3), V = theta N0/(N_d rho), with N0 = 6.258e14 cm^-2 and liquid
        // Ga rho = 52.65 nm^-3 (see IslandNucleationModelTest.hemisphereDropletDiametersMatchVolumeGoldenValues for
        // the arithmetic): 96.83511 nm (2 ML, 1e8), 35.67436 nm (1 ML, 1e9), 16.55857 nm (1 ML, 1e10); at 30 °C
        // under 1e-4 Torr As4 the Ga barely migrates, so the dot keeps the droplet's base
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        double[][] cases = {{2, 1e8, 96.83511}, {1, 1e9, 35.67436}, {1, 1e10, 16.55857}};
        for (double[] k : cases) {
            double d = model.predict(recipe(30, k[0], k[1], flux, "As4"), GAAS_GA, defaults)
                    .value(Role.ISLAND_DIAMETER).orElseThrow();
            assertEquals(k[2], d, 1e-6 * k[2], "diameter for " + k[0] + " ML at " + k[1]);
        }
    }

    @Test
    void migrationLengthFollowsSquareRootOfDiffusionTimesArrivalTime() {
        // L = sqrt(D_c·tau): at 150 °C, E_c = 0.7 eV, nu0 = 1e13 Hz, D_c = 2.5e12·exp(-0.7/kT)/N0 = 1838 nm²/s;
        // 1e-4 Torr As4 gives 6.064e16 atoms cm^-2 s^-1 (RoughBeamFlux), s = 0.5, tau = N0/(s·J) = 0.02064 s,
        // L = 6.16 nm (arithmetic done here, a regression value for the formula only)
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        assertEquals(6.06407e16, flux, 1e-5 * 6.06407e16);
        double l = DropletCrystallizationModel.migrationLengthNm(423.15, flux, 0.5, 0.7, 1e13, 6.258e14);
        double kT = NucleationLaw.BOLTZMANN_EV_PER_K * 423.15;
        double dc = 2.5e12 * Math.exp(-0.7 / kT) * 1e14 / 6.258e14;
        double tau = 6.258e14 / (0.5 * flux);
        assertEquals(Math.sqrt(dc * tau), l, 1e-9 * l);
        assertEquals(6.15959, l, 1e-5 * 6.15959);
        // Arrhenius: tau does not depend on T, so L(T2)/L(T1) = exp(E_c/(2k) (1/T1 - 1/T2)) with
        // k = 8.617333262e-5 eV/K (CODATA 2018); 150 -> 250 °C: exp(0.7/(2k) (1/423.15 - 1/523.15)) = 6.26351
        double hot = DropletCrystallizationModel.migrationLengthNm(523.15, flux, 0.5, 0.7, 1e13, 6.258e14);
        assertEquals(Math.exp(0.7 / (2 * 8.617333262e-5) * (1 / 423.15 - 1 / 523.15)), hot / l, 1e-9 * hot / l);
        assertEquals(6.26351, hot / l, 1e-5 * 6.26351);
        // quadrupling the flux halves L
        assertEquals(0.5, DropletCrystallizationModel.migrationLengthNm(423.15, 4 * flux, 0.5, 0.7, 1e13, 6.258e14) / l,
                1e-12);
    }

    @Test
    void dimerSticksBetterThanTetramerAndFavoursDots() {
        // s(As4) <= 0.5, Foxon & Joyce, Surf. Sci. 50, 434 (1975); s(As2) ≈ 1, Surf. Sci. 64, 293 (1977) (from memory):
        // at the same atom flux dimers arrive twice as effectively, so Ga migrates less
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        double dotAs4 = model.predict(recipe(250, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
        double dotAs2 = model.predict(recipe(250, 1.0, 1e9, flux, "As2"), GAAS_GA, defaults)
                .classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
        assertTrue(dotAs2 > dotAs4, dotAs2 + " > " + dotAs4);
    }

    @Test
    void higherGroupVFluxKeepsDropletsCompact() {
        // high As flux at low T keeps the droplet's base size ("modified droplet epitaxy", JJAP Part 2 (2000))
        double previous = -1;
        for (double bep = 1e-7; bep <= 1e-4 * 1.001; bep *= 10) {
            double dot = model.predict(recipe(200, 1.0, 1e9, RoughBeamFlux.atomFlux(bep, "As4"), "As4"), GAAS_GA,
                    defaults).classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
            assertTrue(dot > previous, "P(dot) did not rise at " + bep + " Torr");
            previous = dot;
        }
    }

    @Test
    void missingDensityAsksForIslandNucleationOrAMeasurement() {
        Conditions c = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 423.15).set(Role.COVERAGE, 1.0)
                .set(Role.GROUP_V_FLUX, 1e15).build();
        Prediction p = model.predict(c, GAAS_GA, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains(IslandNucleationModel.ID), p.validity().reason());
        assertTrue(p.validity().reason().contains("measure"), p.validity().reason());
    }

    @Test
    void densityPredictedByIslandNucleationFeedsThisModel() {
        // the core runs island-nucleation first and passes its ISLAND_DENSITY on (campaign models: order); the
        // crystallised feature is never narrower than the liquid droplet it came from
        IslandNucleationModel upstream = new IslandNucleationModel();
        Conditions deposition = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 423.15)
                .set(Role.DEPOSITION_RATE, 0.1).set(Role.COVERAGE, 2.0).build();
        Prediction droplets = upstream.predict(deposition, GAAS_GA, ParameterValues.defaults(upstream.parameters()));
        double density = droplets.value(Role.ISLAND_DENSITY).orElseThrow();
        for (double bep : new double[] {1e-4, 1e-6}) {
            Prediction p = model.predict(recipe(150, 2.0, density, RoughBeamFlux.atomFlux(bep, "As4"), "As4"),
                    GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertTrue(p.value(Role.ISLAND_DIAMETER).orElseThrow()
                    >= droplets.value(Role.ISLAND_DIAMETER).orElseThrow() * (1 - 1e-12));
        }
    }

    @Test
    void substrateTemperatureIsUsedWhenNoCrystallisationTemperatureIsGiven() {
        double flux = RoughBeamFlux.atomFlux(1e-5, "As4");
        Conditions fallback = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 150 + CELSIUS)
                .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux)
                .set(Role.GROUP_V_SPECIES, "As4").build();
        Prediction viaSubstrate = model.predict(fallback, GAAS_GA, defaults);
        Prediction direct = model.predict(recipe(150, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults);
        assertEquals(direct.probabilities(), viaSubstrate.probabilities());
        assertTrue(viaSubstrate.notes().stream().anyMatch(n -> n.contains("substrate temperature is used")));
    }

    @Test
    void solidIndiumIsNotTreatedAsLiquidDroplets() {
        // In melts at 156.5985 °C (ITS-90, from memory); Tuktamyshev et al., Nanomaterials 10, 1512 (2020)
        double flux = RoughBeamFlux.atomFlux(1e-5, "As4");
        Prediction cold = model.predict(recipe(140, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertFalse(cold.validity().valid());
        assertTrue(cold.validity().reason().contains("156.6 °C"), cold.validity().reason());
        Prediction warm = model.predict(recipe(170, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertTrue(warm.validity().valid(), warm.validity().reason());
    }

    @Test
    void closedValveBelowEtchingOnsetIsFlagged() {
        Prediction p = model.predict(recipe(200, 1.0, 1e9, 0.0, "As4"), GAAS_GA, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains("no group-V flux"), p.validity().reason());
        assertTrue(p.value(Role.ISLAND_DIAMETER).isEmpty());
    }

    @Test
    void missingSpeciesAssumesTetramerAndSaysSo() {
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        Conditions noSpecies = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 250 + CELSIUS)
                .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux).build();
        Prediction p = model.predict(noSpecies, GAAS_GA, defaults);
        assertEquals(model.predict(recipe(250, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults).probabilities(),
                p.probabilities());
        assertTrue(p.notes().stream().anyMatch(n -> n.contains("tetramer")));
    }
}
