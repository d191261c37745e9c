package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.Validity;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Strained-layer islands in Stranski-Krastanov growth: no three-dimensional islands below a critical
 * coverage, then a density that rises as a power law of the coverage past it and follows nucleation
 * scaling in temperature and rate.
 *
 * <p><b>Equations.</b>
 * <pre>
 *   x = (θ − θc) / w                               θ = Role.COVERAGE, θc = critical_thickness, w = ONSET_WIDTH_ML
 *   Δ = w · ln(1 + e^x)                            excess coverage past the onset, ML (smoothed)
 *   N = N_nuc(T, F) · (Δ / 1 ML)^p                 p = onset_exponent
 *   P(dots) = 1/(1 + e^−x),   P(wetting-layer) = 1 − P(dots)
 * </pre>
 * {@code N_nuc} is the saturation density of {@link NucleationLaw} for three-dimensional islands
 * ({@code alpha = 2.5}) at {@link Role#SUBSTRATE_TEMPERATURE} and {@link Role#DEPOSITION_RATE} (the InAs
 * rate in ML/s), with {@link Role#SURFACTANT_COVERAGE} shifting the diffusion barrier when the recipe sets
 * it: it is the density one monolayer past the onset. For {@code θ − θc >> w}, {@code Δ = θ − θc} and the
 * density is the power law of Leonard, Pond and Petroff, PRB 50, 11687 (1994) (exponent 1.76, from
 * memory). Far below the onset the density falls off as {@code e^(p·x)}: the model says "no islands",
 * never a negative or undefined density, so runs recorded below detection ({@code <1e8}) or as the class
 * {@value #WETTING_LAYER} both enter a fit. The smoothing over {@code w} stands for the spread of the
 * onset across a sample (coverage non-uniformity; Patella et al. resolve two thresholds, 1.45 and 1.59 ML,
 * for two dot families); it is a Terrace choice, not a published law.
 *
 * <p><b>Outcomes.</b> {@link Role#ISLAND_DENSITY} and {@link Role#GROWTH_MODE} with the classes
 * {@value #WETTING_LAYER} (two-dimensional: streaky RHEED, no dots) and {@value #DOTS} (spotty RHEED, 3D
 * islands). Island diameter and height are not predicted: no general published relation between them and
 * the recipe was verified for this plugin.
 *
 * <p><b>Validity.</b> Defaults exist only for InAs on GaAs(001): the campaign's material must be substrate
 * GaAs, deposit In and group V As. Other systems, and InGaAs layers (no published relation of the onset
 * to the In fraction is used here), are not applicable. Predictions are outside the model when the
 * adatoms make fewer than {@link NucleationLaw#MIN_HOP_TO_DEPOSITION_RATIO} hops per monolayer and when
 * the coverage lies more than {@link #MAX_EXCESS_ML} ML past the onset, where dots ripen and coalesce.
 *
 * @since 0.3
 */
public final class CriticalThicknessModel implements GrowthModel {

    /** The campaign-format id of this model. */
    public static final String ID = "critical-thickness";

    /** Class name for a surface with only the two-dimensional wetting layer. */
    public static final String WETTING_LAYER = "wetting-layer";

    /** Class name for a surface with three-dimensional strained islands. */
    public static final String DOTS = "dots";

    /** Parameter name of the critical coverage. */
    public static final String CRITICAL_THICKNESS = "critical_thickness";

    /** Parameter name of the exponent of the rise past the onset. */
    public static final String ONSET_EXPONENT = "onset_exponent";

    /**
     * Default critical thickness of InAs on GaAs(001), 1.59 ML: the threshold of the large-dot family,
     * Patella, Arciprete, Placidi et al., arXiv cond-mat/0510353 (2005) (small dots from 1.45 ML);
     * Leonard, Pond and Petroff, PRB 50, 11687 (1994) report an onset near 1.5-1.6 ML (from memory).
     */
    public static final double DEFAULT_CRITICAL_THICKNESS_ML = 1.59;

    /** Lowest critical thickness a fit may reach, 1.0 ML (Terrace choice, below all InAs/GaAs values cited). */
    public static final double MIN_CRITICAL_THICKNESS_ML = 1.0;

    /** Highest critical thickness a fit may reach, 2.5 ML (Terrace choice, above all InAs/GaAs values cited). */
    public static final double MAX_CRITICAL_THICKNESS_ML = 2.5;

    /**
     * Default exponent of the density's rise past the onset, 1.76: Leonard, Pond and Petroff, PRB 50, 11687
     * (1994), density proportional to (θ − θc)^1.76 (from memory).
     */
    public static final double DEFAULT_ONSET_EXPONENT = 1.76;

    /**
     * Width of the onset, 0.05 ML: Patella et al. (arXiv cond-mat/0510353) resolve thresholds 0.14 ML apart, so
     * the onset is sharp on that scale; 0.05 ML keeps P(dots) between 0.12 and 0.88 within ±0.1 ML of θc
     * (Terrace choice). It is a fixed smoothing, not a fitted parameter: densities cannot tell it apart from
     * the critical thickness and the exponent.
     */
    public static final double ONSET_WIDTH_ML = 0.05;

    /**
     * Default In adatom diffusion barrier, 1.04 eV: the value used for In adatoms in rate equations of the
     * InAs/GaAs(001) wetting layer by Zhang, Chen, Zhou, Tang, Wang, Nanoscale Res. Lett. 7, 600 (2012).
     */
    public static final double DEFAULT_IN_DIFFUSION_BARRIER_EV = 1.04;

    /**
     * Default critical size, 3: with the other defaults it gives a few 1e10 cm^-2 one monolayer past the onset
     * at 500 °C and 0.05 ML/s, the usual range of InAs/GaAs(001) dot densities (common practice); i = 1 would
     * give about 1e12 cm^-2. Patella et al. find that the critical nucleus differs between the two dot families.
     */
    public static final double DEFAULT_SK_CRITICAL_SIZE = 3;

    /**
     * Largest excess coverage past the onset for which predictions are marked valid, 1.5 ML: further on dots
     * ripen and coalesce and the density stops rising (Leonard et al. 1994 see the density level off, from
     * memory); Terrace choice.
     */
    public static final double MAX_EXCESS_ML = 1.5;

    /**
     * Smallest density the model reports, 1 cm^-2: far below any microscope's detection, it keeps the log
     * scale finite far below the onset (Terrace choice).
     */
    public static final double MIN_DENSITY_PER_CM2 = 1.0;

    /** The only material system with published defaults: substrate, deposited metal, group V. */
    static final String SUBSTRATE = "GaAs";
    static final String DEPOSIT = "In";
    static final String GROUP_V = "As";

    private static final List<String> CLASSES = List.of(WETTING_LAYER, DOTS);

    private static final List<ModelParameter> PARAMETERS;

    static {
        List<ModelParameter> p = new ArrayList<>();
        p.add(ModelParameter.continuous(CRITICAL_THICKNESS, "ML", DEFAULT_CRITICAL_THICKNESS_ML,
                MIN_CRITICAL_THICKNESS_ML, MAX_CRITICAL_THICKNESS_ML, false,
                "InAs/GaAs(001): 1.45 and 1.59 ML for two dot families, Patella et al., arXiv cond-mat/0510353 "
                        + "(2005); onset near 1.5-1.6 ML, Leonard, Pond, Petroff, PRB 50, 11687 (1994) (from memory)",
                "InAs coverage at which strained 3D islands appear on the wetting layer"));
        p.add(ModelParameter.continuous(ONSET_EXPONENT, "", DEFAULT_ONSET_EXPONENT, 0.5, 4.0, false,
                "Leonard, Pond, Petroff, PRB 50, 11687 (1994): density ∝ (θ − θc)^1.76 (from memory); bounds "
                        + "a Terrace choice",
                "exponent of the island density's rise with the coverage past the critical thickness"));
        for (ModelParameter q : NucleationLaw.parameters()) {
            if (q.name().equals(NucleationLaw.DIFFUSION_BARRIER)) {
                p.add(new ModelParameter(q.name(), q.unit(), DEFAULT_IN_DIFFUSION_BARRIER_EV, q.min(), q.max(),
                        q.choices(), q.logScale(), "Zhang et al., Nanoscale Res. Lett. 7, 600 (2012): 1.04 eV for "
                        + "In adatoms in rate equations of the InAs/GaAs(001) wetting layer",
                        "In adatom hop barrier E_d on the wetting layer; D = (nu0/4)·exp(-E_d/kT)", ""));
            } else if (q.name().equals(NucleationLaw.CRITICAL_SIZE)) {
                p.add(new ModelParameter(q.name(), q.unit(), DEFAULT_SK_CRITICAL_SIZE, q.min(), q.max(),
                        q.choices(), q.logScale(), "i = 3 gives the usual few 1e10 cm^-2 InAs/GaAs dot densities "
                        + "with the other defaults (common practice); Patella et al., arXiv cond-mat/0510353: the "
                        + "critical nucleus differs between dot families", q.description(), ""));
            } else {
                // the In adatoms on a strained wetting layer are not the Ga adatoms of the other plugins:
                // no shared meaning
                p.add(new ModelParameter(q.name(), q.unit(), q.defaultValue(), q.min(), q.max(), q.choices(),
                        q.logScale(), q.source(), q.description(), ""));
            }
        }
        PARAMETERS = List.copyOf(p);
    }

    /** Creates the model; it is stateless. */
    public CriticalThicknessModel() {
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public String description() {
        return "Strained-layer (Stranski-Krastanov) islands of InAs on GaAs(001): no 3D islands below a critical "
                + "thickness, then a density rising as a power law of the excess coverage, with nucleation scaling "
                + "in temperature and rate.";
    }

    @Override
    public Set<Role> requiredInputs() {
        return Set.of(Role.SUBSTRATE_TEMPERATURE, Role.DEPOSITION_RATE, Role.COVERAGE);
    }

    @Override
    public Set<Role> optionalInputs() {
        return Set.of(Role.SURFACTANT_COVERAGE);
    }

    @Override
    public Set<Role> predictedOutcomes() {
        return Set.of(Role.ISLAND_DENSITY, Role.GROWTH_MODE);
    }

    @Override
    public List<String> classes(Role role) {
        return role == Role.GROWTH_MODE ? CLASSES : List.of();
    }

    @Override
    public List<ModelParameter> parameters() {
        return PARAMETERS;
    }

    /**
     * Why a growth surface lies outside the systems with published data, if it does.
     *
     * @param surface the growth surface
     * @return the reason, empty for InAs on GaAs(001)
     */
    static Optional<String> outsideMaterials(Surface surface) {
        String deposit = surface.depositMetal().orElse(null);
        if (SUBSTRATE.equals(surface.substrate()) && DEPOSIT.equals(deposit) && GROUP_V.equals(surface.groupV())) {
            return Optional.empty();
        }
        String system = deposit == null ? "a campaign with no deposit metal"
                : deposit + (surface.groupV() == null ? "" : surface.groupV()) + " on " + surface.substrate();
        return Optional.of("critical-thickness has published strained-island data only for InAs on GaAs(001) "
                + "(material: substrate GaAs, deposit In, group_v As); " + system + " is outside its validity, "
                + "and so are InGaAs layers (no published relation of the onset to the In fraction is used)");
    }

    @Override
    public Prediction predict(Conditions conditions, Surface surface, ParameterValues parameters) {
        Optional<String> bad = ModelSupport.outOfBounds(PARAMETERS, parameters);
        if (bad.isPresent()) {
            return Prediction.notApplicable(bad.get());
        }
        for (Role r : List.of(Role.SUBSTRATE_TEMPERATURE, Role.DEPOSITION_RATE, Role.COVERAGE)) {
            if (conditions.value(r).isEmpty()) {
                return Prediction.notApplicable("critical-thickness needs the " + r.key() + " of the InAs layer");
            }
        }
        Optional<String> material = outsideMaterials(surface);
        if (material.isPresent()) {
            return Prediction.notApplicable(material.get());
        }
        double t = conditions.value(Role.SUBSTRATE_TEMPERATURE).getAsDouble();
        double rate = conditions.value(Role.DEPOSITION_RATE).getAsDouble();
        double coverage = conditions.value(Role.COVERAGE).getAsDouble();
        double surfactant = conditions.value(Role.SURFACTANT_COVERAGE).orElse(0.0);
        if (!(t > 0)) {
            return Prediction.notApplicable("substrate temperature must be above 0 K");
        }
        if (!(rate > 0)) {
            return Prediction.notApplicable("InAs deposition rate must be positive for strained islands to form");
        }
        if (coverage < 0) {
            return Prediction.notApplicable("InAs coverage cannot be negative");
        }
        if (surfactant < 0) {
            return Prediction.notApplicable("surfactant coverage cannot be negative");
        }

        NucleationLaw law = NucleationLaw.from(parameters, NucleationLaw.ALPHA_3D);
        double thetaC = parameters.get(CRITICAL_THICKNESS);
        double width = ONSET_WIDTH_ML;
        double exponent = parameters.get(ONSET_EXPONENT);
        List<String> reasons = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        if (law.rawEffectiveBarrierEv(surfactant) <= 0) {
            reasons.add("the surfactant shift brings the In diffusion barrier to "
                    + ModelSupport.sig3(law.rawEffectiveBarrierEv(surfactant)) + " eV; hopping is no longer activated");
        }
        double lnHopsPerMl = law.lnHopRate(t, surfactant) - Math.log(rate);
        if (lnHopsPerMl < Math.log(NucleationLaw.MIN_HOP_TO_DEPOSITION_RATIO)) {
            reasons.add("In adatoms make only about " + ModelSupport.sig3(Math.exp(lnHopsPerMl))
                    + " hops per deposited monolayer (D/F); nucleation scaling needs D/F above "
                    + ModelSupport.sig3(NucleationLaw.MIN_HOP_TO_DEPOSITION_RATIO));
        }
        double excess = coverage - thetaC;
        if (excess > MAX_EXCESS_ML) {
            reasons.add("the InAs coverage lies " + ModelSupport.sig3(excess) + " ML past the critical thickness ("
                    + ModelSupport.sig3(thetaC) + " ML); beyond " + MAX_EXCESS_ML
                    + " ML the dots ripen and coalesce and the power-law rise no longer applies");
        }

        double density = density(law, rate, t, surfactant, coverage, thetaC, width, exponent, surface.sitesPerCm2());
        double pDots = ModelSupport.logistic(excess / width);
        Map<Role, Double> values = new EnumMap<>(Role.class);
        values.put(Role.ISLAND_DENSITY, density);
        if (excess < 0) {
            notes.add("below the critical thickness (" + ModelSupport.sig3(thetaC) + " ML) by "
                    + ModelSupport.sig3(-excess) + " ML: no strained 3D islands expected, only the wetting layer"
                    + " (streaky RHEED)");
        } else {
            notes.add(ModelSupport.sig3(excess) + " ML past the critical thickness (" + ModelSupport.sig3(thetaC)
                    + " ML): strained InAs islands on the wetting layer");
        }
        IslandNucleationModel.surfactantNote(law, surfactant).ifPresent(notes::add);
        Map<String, Double> probabilities = new LinkedHashMap<>();
        probabilities.put(WETTING_LAYER, 1.0 - pDots);
        probabilities.put(DOTS, pDots);
        Validity validity = reasons.isEmpty() ? Validity.ok() : Validity.outside(String.join("; ", reasons));
        return new Prediction(values, Map.of(Role.GROWTH_MODE, probabilities), validity, notes);
    }

    /**
     * The island density, without validity checks.
     *
     * @param law            the nucleation law (alpha = 2.5)
     * @param rateMlPerS     InAs deposition rate in ML/s; positive
     * @param temperatureK   substrate temperature in K; positive
     * @param surfactantMl   surfactant pre-coverage in ML
     * @param coverageMl     InAs coverage in ML
     * @param criticalMl     critical thickness θc in ML
     * @param widthMl        onset width w in ML; positive
     * @param exponent       exponent p of the rise
     * @param sitesPerCm2    surface sites per ML in cm^-2
     * @return the density in cm^-2, between {@link #MIN_DENSITY_PER_CM2} and {@code sitesPerCm2}
     */
    public static double density(NucleationLaw law, double rateMlPerS, double temperatureK, double surfactantMl,
                                 double coverageMl, double criticalMl, double widthMl, double exponent,
                                 double sitesPerCm2) {
        double lnNuc = Math.log(sitesPerCm2)
                + Math.min(0.0, law.lnDensityPerSite(rateMlPerS, temperatureK, surfactantMl));
        double ln = lnNuc + exponent * lnExcessMl(coverageMl, criticalMl, widthMl);
        ln = Math.max(Math.log(MIN_DENSITY_PER_CM2), Math.min(Math.log(sitesPerCm2), ln));
        return Math.exp(ln);
    }

    /**
     * Natural logarithm of the smoothed excess coverage {@code Δ = w·ln(1 + e^x)}, {@code x = (θ − θc)/w},
     * computed without overflow or underflow.
     *
     * @param coverageMl θ in ML
     * @param criticalMl θc in ML
     * @param widthMl    w in ML; positive
     * @return ln(Δ / 1 ML), finite
     */
    public static double lnExcessMl(double coverageMl, double criticalMl, double widthMl) {
        double x = (coverageMl - criticalMl) / widthMl;
        double lnSoftplus;
        if (x > 30) {
            lnSoftplus = Math.log(x + Math.log1p(Math.exp(-x)));
        } else if (x < -30) {
            lnSoftplus = x;  // ln(ln(1 + e^x)) -> x as x -> −∞ (relative error below e^-30)
        } else {
            lnSoftplus = Math.log(Math.log1p(Math.exp(x)));
        }
        return Math.log(widthMl) + lnSoftplus;
    }
}
