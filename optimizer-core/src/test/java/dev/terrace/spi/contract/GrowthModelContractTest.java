package dev.terrace.spi.contract;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Quantity;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.ServiceLoader;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.random.RandomGenerator;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * The contract every {@link GrowthModel} plugin must meet; a plugin's test class extends this one and
 * supplies the model, a typical recipe and a typical surface.
 *
 * <p>The cases check the metadata (id, description, outcomes, parameters), that defaults on the typical
 * recipe give a valid, finite, normalised prediction, that a seeded sweep of temperatures, rates, fluxes
 * and parameter values never throws and never yields a non-finite number or unnormalised probabilities,
 * that missing required inputs are reported rather than thrown, and that the class is registered for
 * {@link ServiceLoader}. A plugin that must deviate overrides the case and says why.
 *
 * <p>This class ships in optimizer-core's test jar.
 *
 * @since 0.1
 */
public abstract class GrowthModelContractTest {

    /** Seed of the random sweep; fixed so that any failure reproduces. */
    protected static final long SWEEP_SEED = 20240611L;

    /** Number of random recipes in the sweep (per surface). */
    protected static final int SWEEP_SIZE = 1500;

    /** Lowest temperature in the sweep, K. */
    protected static final double SWEEP_LOW_K = 150;

    /** Highest temperature in the sweep, K. */
    protected static final double SWEEP_HIGH_K = 1100;

    /** Decades either side of a typical rate, flux, coverage or density covered by the sweep. */
    protected static final double SWEEP_DECADES = 3;

    /** Largest miscut in the sweep, degrees. */
    protected static final double SWEEP_MAX_MISCUT_DEG = 6;

    /** Group-V species the sweep draws from when the typical recipe names one. */
    protected static final List<String> SWEEP_SPECIES = List.of("As2", "As4", "Sb2", "Sb4", "P2", "P4");

    private static final Pattern ID = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");
    private static final Pattern PARAMETER_NAME = Pattern.compile("[a-z][a-z0-9]*(_[a-z0-9]+)*");

    /** @return a fresh instance of the model under test; never null */
    protected abstract GrowthModel model();

    /** @return a recipe inside the model's assumptions, with every required input set; never null */
    protected abstract Conditions typicalConditions();

    /** @return the surface the typical recipe is grown on; never null */
    protected abstract Surface typicalSurface();

    /**
     * Surfaces the sweep uses: the typical one and, when it has a deposit metal, the same substrate with no
     * deposit (film growth). Override to add more.
     *
     * @return the surfaces; never null, not empty
     */
    protected List<Surface> sweepSurfaces() {
        Surface s = typicalSurface();
        List<Surface> list = new ArrayList<>();
        list.add(s);
        if (s.depositMetal().isPresent()) {
            list.add(new Surface(s.substrate(), s.monolayerHeightNm(), s.sitesPerCm2(), null, Double.NaN,
                    Double.NaN, s.groupV()));
        }
        return list;
    }

    /**
     * A random recipe around the typical one: temperatures uniform in [{@value #SWEEP_LOW_K},
     * {@value #SWEEP_HIGH_K}] K, miscut uniform in [0, {@value #SWEEP_MAX_MISCUT_DEG}]°, other numbers
     * log-uniform within {@value #SWEEP_DECADES} decades of the typical value (sometimes zero), group-V
     * species drawn from {@link #SWEEP_SPECIES}.
     *
     * @param rng the random source; never null
     * @return the recipe; never null
     */
    protected Conditions randomConditions(RandomGenerator rng) {
        Conditions typical = typicalConditions();
        Conditions.Builder b = Conditions.builder();
        typical.numbers().forEach((role, v) -> b.set(role, randomValue(role, v, rng)));
        typical.categories().forEach((role, v) -> b.set(role, role == Role.GROUP_V_SPECIES
                ? SWEEP_SPECIES.get(rng.nextInt(SWEEP_SPECIES.size())) : v));
        return b.build();
    }

    private static double randomValue(Role role, double typical, RandomGenerator rng) {
        if (role.quantity() == Quantity.TEMPERATURE) {
            return rng.nextDouble(SWEEP_LOW_K, SWEEP_HIGH_K);
        }
        if (role.quantity() == Quantity.ANGLE) {
            return rng.nextDouble() < 0.1 ? 0.0 : rng.nextDouble(0, SWEEP_MAX_MISCUT_DEG);
        }
        if (rng.nextDouble() < 0.05) {
            return 0.0;
        }
        double base = typical > 0 ? typical : 1.0;
        return base * Math.pow(10, rng.nextDouble(-SWEEP_DECADES, SWEEP_DECADES));
    }

    /**
     * Random parameter values inside each parameter's bounds: one of the choices for a discrete
     * parameter, log-uniform for a log-scale one, uniform otherwise.
     *
     * @param rng the random source; never null
     * @return the values; never null
     */
    protected ParameterValues randomParameters(RandomGenerator rng) {
        Map<String, Double> m = new LinkedHashMap<>();
        for (ModelParameter p : model().parameters()) {
            double v;
            if (p.isDiscrete()) {
                v = p.choices().get(rng.nextInt(p.choices().size()));
            } else if (p.min() == p.max()) {
                v = p.min();
            } else if (p.logScale()) {
                v = Math.exp(rng.nextDouble(Math.log(p.min()), Math.log(p.max())));
            } else {
                v = rng.nextDouble(p.min(), p.max());
            }
            m.put(p.name(), v);
        }
        return new ParameterValues(m);
    }

    private ParameterValues corner(boolean high) {
        Map<String, Double> m = new LinkedHashMap<>();
        model().parameters().forEach(p -> m.put(p.name(), high ? p.max() : p.min()));
        return new ParameterValues(m);
    }

    @Test
    void idIsLowerCaseHyphenatedAndNonBlank() {
        String id = model().id();
        assertNotNull(id);
        assertFalse(id.isBlank(), "id is blank");
        assertTrue(ID.matcher(id).matches(), "id '" + id + "' is not lower-case and hyphenated");
    }

    @Test
    void descriptionIsNonBlank() {
        assertNotNull(model().description());
        assertFalse(model().description().isBlank(), "description is blank");
    }

    @Test
    void predictedOutcomesAreNonEmptyAndAllOutcomeRoles() {
        Set<Role> outcomes = model().predictedOutcomes();
        assertNotNull(outcomes);
        assertFalse(outcomes.isEmpty(), "a model must predict at least one outcome");
        for (Role r : outcomes) {
            assertEquals(Role.Kind.OUTCOME, r.kind(), r.key() + " is not an outcome role");
        }
        // Behaviour: every announced outcome is actually predicted, on the typical recipe or on some valid
        // recipe of the first 300 sweep cases per surface with default parameters.
        GrowthModel m = model();
        ParameterValues defaults = ParameterValues.defaults(m.parameters());
        Set<Role> seen = new HashSet<>();
        Prediction typical = m.predict(typicalConditions(), typicalSurface(), defaults);
        seen.addAll(typical.values().keySet());
        seen.addAll(typical.probabilities().keySet());
        RandomGenerator rng = new SplittableRandom(SWEEP_SEED);
        for (Surface surface : sweepSurfaces()) {
            for (int i = 0; i < 300 && !seen.containsAll(outcomes); i++) {
                Prediction p = m.predict(randomConditions(rng), surface, defaults);
                if (p.validity().valid()) {
                    seen.addAll(p.values().keySet());
                    seen.addAll(p.probabilities().keySet());
                }
            }
        }
        assertEquals(outcomes, seen, "announced outcomes against those ever predicted");
    }

    @Test
    void inputSetsAreDisjointAndNonNull() {
        Set<Role> required = model().requiredInputs();
        Set<Role> optional = model().optionalInputs();
        assertNotNull(required);
        assertNotNull(optional);
        Set<Role> both = new HashSet<>(required);
        both.retainAll(optional);
        assertTrue(both.isEmpty(), "roles both required and optional: " + both);
        // Behaviour: a model reads only the inputs it declares (the core chains models by these sets), so
        // setting any undeclared role on the typical recipe must leave the prediction unchanged.
        GrowthModel m = model();
        ParameterValues defaults = ParameterValues.defaults(m.parameters());
        Conditions typical = typicalConditions();
        Prediction base = m.predict(typical, typicalSurface(), defaults);
        for (Role r : Role.values()) {
            if (required.contains(r) || optional.contains(r) || r.quantity() == Quantity.CLASS
                    || typical.numbers().containsKey(r)
                    || typical.categories().containsKey(r)) {
                continue;
            }
            Conditions.Builder b = Conditions.builder();
            typical.numbers().forEach(b::set);
            typical.categories().forEach(b::set);
            if (r.quantity() == Quantity.CATEGORY) {
                b.set(r, SWEEP_SPECIES.get(0));
            } else {
                b.set(r, r.quantity() == Quantity.TEMPERATURE ? 500.0 : 1.0);
            }
            assertEquals(base, m.predict(b.build(), typicalSurface(), defaults),
                    "undeclared input " + r.key() + " changed the prediction");
        }
    }

    @Test
    void classValuedOutcomesListDistinctClasses() {
        for (Role r : model().predictedOutcomes()) {
            List<String> classes = model().classes(r);
            assertNotNull(classes);
            if (r.quantity() == Quantity.CLASS) {
                assertFalse(classes.isEmpty(), "no classes listed for " + r.key());
                assertEquals(classes.size(), new HashSet<>(classes).size(), "duplicate class names for " + r.key());
                classes.forEach(c -> assertFalse(c.isBlank(), "blank class name for " + r.key()));
            } else {
                assertTrue(classes.isEmpty(), "numeric outcome " + r.key() + " lists classes");
            }
        }
    }

    @Test
    void parametersHaveUniqueNamesSourcesAndDefaultsInsideBounds() {
        List<ModelParameter> parameters = model().parameters();
        assertNotNull(parameters);
        Set<String> names = new HashSet<>();
        for (ModelParameter p : parameters) {
            assertTrue(names.add(p.name()), "duplicate parameter name " + p.name());
            assertTrue(PARAMETER_NAME.matcher(p.name()).matches(), "parameter name '" + p.name()
                    + "' is not lower case with underscores");
            assertFalse(p.source().isBlank(), "parameter " + p.name() + " has no source");
            assertFalse(p.description().isBlank(), "parameter " + p.name() + " has no description");
            assertTrue(Double.isFinite(p.min()) && Double.isFinite(p.max()), p.name() + " has infinite bounds");
            assertTrue(p.min() <= p.defaultValue() && p.defaultValue() <= p.max(),
                    "default of " + p.name() + " outside its bounds");
            if (p.isDiscrete()) {
                assertTrue(p.choices().contains(p.defaultValue()), "default of " + p.name() + " is not a choice");
            } else {
                assertTrue(p.min() < p.max(), "continuous parameter " + p.name() + " has an empty range");
            }
            if (p.logScale()) {
                assertTrue(p.min() > 0, "log-scale parameter " + p.name() + " needs a positive minimum");
            }
        }
    }

    @Test
    void defaultsOnTypicalConditionsGiveValidFiniteNormalisedPrediction() {
        GrowthModel m = model();
        Prediction p = m.predict(typicalConditions(), typicalSurface(), ParameterValues.defaults(m.parameters()));
        assertNotNull(p);
        assertTrue(p.validity().valid(), "typical recipe not valid: " + p.validity().reason());
        assertFalse(p.values().isEmpty() && p.probabilities().isEmpty(), "typical recipe predicts nothing");
        checkPrediction(m, p, "typical recipe");
        for (Role r : m.predictedOutcomes()) {
            if (r.quantity() == Quantity.CLASS) {
                assertEquals(Set.copyOf(m.classes(r)), p.classProbabilities(r).keySet(),
                        "class probabilities for " + r.key() + " do not cover the listed classes");
            }
        }
    }

    @Test
    void predictionIsRepeatable() {
        GrowthModel m = model();
        ParameterValues defaults = ParameterValues.defaults(m.parameters());
        assertEquals(m.predict(typicalConditions(), typicalSurface(), defaults),
                model().predict(typicalConditions(), typicalSurface(), defaults),
                "the same recipe gave two different predictions");
    }

    @Test
    void seededSweepNeverThrowsAndStaysFiniteAndNormalised() {
        GrowthModel m = model();
        RandomGenerator rng = new SplittableRandom(SWEEP_SEED);
        List<ParameterValues> fixed = List.of(ParameterValues.defaults(m.parameters()), corner(false), corner(true));
        int valid = 0;
        int total = 0;
        for (Surface surface : sweepSurfaces()) {
            for (int i = 0; i < SWEEP_SIZE; i++) {
                Conditions c = randomConditions(rng);
                ParameterValues v = i < fixed.size() * 100 ? fixed.get(i % fixed.size()) : randomParameters(rng);
                String where = "sweep case " + i + " on " + surface.substrate() + "/" + surface.deposit()
                        + " with " + c + " and " + v;
                Prediction p = assertDoesNotThrow(() -> m.predict(c, surface, v), where);
                checkPrediction(m, p, where);
                total++;
                if (p.validity().valid()) {
                    valid++;
                }
            }
        }
        assertTrue(valid > 0, "none of the " + total + " sweep predictions was valid; the sweep checked nothing");
    }

    @Test
    void missingRequiredInputIsReportedNotThrown() {
        GrowthModel m = model();
        ParameterValues defaults = ParameterValues.defaults(m.parameters());
        for (Role missing : m.requiredInputs()) {
            Conditions.Builder b = Conditions.builder();
            typicalConditions().numbers().forEach((r, v) -> {
                if (r != missing) {
                    b.set(r, v);
                }
            });
            typicalConditions().categories().forEach((r, v) -> {
                if (r != missing) {
                    b.set(r, v);
                }
            });
            Prediction p = assertDoesNotThrow(() -> m.predict(b.build(), typicalSurface(), defaults),
                    "predict threw without " + missing.key());
            assertFalse(p.validity().valid(), "prediction without required input " + missing.key() + " is valid");
            assertFalse(p.validity().reason().isBlank());
        }
    }

    @Test
    void registeredInMetaInfServicesAndLoadedByServiceLoader() {
        GrowthModel m = model();
        List<ServiceLoader.Provider<GrowthModel>> providers = ServiceLoader
                .load(GrowthModel.class, m.getClass().getClassLoader()).stream().collect(Collectors.toList());
        List<ServiceLoader.Provider<GrowthModel>> mine = providers.stream()
                .filter(p -> p.type() == m.getClass()).collect(Collectors.toList());
        if (mine.isEmpty()) {
            fail(m.getClass().getName() + " is not listed in META-INF/services/" + GrowthModel.class.getName());
        }
        assertEquals(1, mine.size(), "listed more than once");
        GrowthModel loaded = mine.get(0).get();
        assertEquals(m.id(), loaded.id());
        long sameId = providers.stream().filter(p -> p.get().id().equals(m.id())).count();
        assertEquals(1, sameId, "another registered model uses the id " + m.id());
    }

    private static void checkPrediction(GrowthModel m, Prediction p, String where) {
        assertNotNull(p, "null prediction for " + where);
        assertNotNull(p.validity(), where);
        if (!p.validity().valid()) {
            assertFalse(p.validity().reason().isBlank(), "invalid without a reason: " + where);
        }
        p.values().forEach((role, v) -> {
            assertTrue(Double.isFinite(v), role.key() + " = " + v + " at " + where);
            assertTrue(m.predictedOutcomes().contains(role), "unannounced outcome " + role.key() + " at " + where);
        });
        p.probabilities().forEach((role, probs) -> {
            assertTrue(m.predictedOutcomes().contains(role), "unannounced outcome " + role.key() + " at " + where);
            assertEquals(Set.copyOf(m.classes(role)), probs.keySet(), "classes of " + role.key() + " at " + where);
            double sum = 0;
            for (double q : probs.values()) {
                assertTrue(q >= 0 && q <= 1, "probability " + q + " at " + where);
                sum += q;
            }
            assertEquals(1.0, sum, Prediction.PROBABILITY_SUM_TOLERANCE, "probabilities sum at " + where);
        });
        assertNotNull(p.notes(), where);
        p.notes().forEach(n -> assertFalse(n.isBlank(), "blank note at " + where));
    }
}
