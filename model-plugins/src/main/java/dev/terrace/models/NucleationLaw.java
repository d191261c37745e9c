package dev.terrace.models;

import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;

import java.util.List;

/**
 * The rate-equation scaling law for the saturation density of islands or droplets under complete
 * condensation, shared by the {@code island-nucleation} and {@code step-flow} plugins.
 *
 * <p>The law (Venables, Phil. Mag. 27, 697 (1973); Venables, Spiller, Hanbücken, Rep. Prog. Phys. 47,
 * 399 (1984)) is
 * <pre>
 *   N / N0 = eta · (F / D)^chi · exp( E_i / ((i + alpha) · k_B · T) ),   chi = i / (i + alpha)
 * </pre>
 * with {@code N0} the surface sites per monolayer, {@code F} the deposition rate in ML/s (atoms per
 * site per second), {@code D} the adatom hop rate per site in s^-1, {@code i} the critical cluster size,
 * {@code E_i} the binding energy of the critical cluster ({@code E_1 = 0} by definition) and
 * {@code alpha = 2} for two-dimensional islands or {@code 2.5} for three-dimensional islands and
 * droplets. Both rates are per site, so {@code F/D} is dimensionless.
 *
 * <p><b>Diffusion convention.</b> The hop rate is {@code D = (nu0 / 4) · exp(−E_d / k_B T)}, with
 * {@code nu0} the <em>total</em> attempt frequency out of a site on a square lattice; equivalently the
 * tracer diffusion coefficient is {@code (nu0/4)·a²·exp(−E_d/k_B T)}. This is Venables' and Brune's usual
 * form. Taking {@code nu0} as the attempt rate per neighbour direction instead raises {@code D} by 4 and
 * lowers {@code N} by {@code 4^(−chi)} (0.630 for i = 1, 2D), so a fitted attempt frequency is only
 * meaningful together with this convention.
 *
 * <p><b>Surfactant.</b> A surfactant pre-coverage {@code θ_s} (ML) shifts the barrier in proportion to the
 * covered fraction of the surface and saturates at a full layer:
 * {@code E_d,eff = E_d + shift · min(θ_s / 1 ML, 1)}, with {@code shift} the change at a full layer (eV).
 * The saturation follows the picture of surfactant-mediated epitaxy, in which the surfactant forms one
 * layer that floats on the growth front and excess surfactant does not change it further (Copel, Reuter,
 * Kaxiras, Tromp, PRL 63, 632 (1989), from memory). The linear rise below a full layer is a mean-field
 * average of bare and covered sites (Terrace choice). The sign is free: some surfactants lengthen the
 * adatom diffusion length and others shorten it (Massies and Grandjean, PRB 48, 8502 (1993): Pb increases
 * it, Te decreases it). A positive shift lowers {@code D} and raises {@code N}; a negative shift (faster
 * adatoms) lowers {@code N}. No general published value of the shift exists; it is fitted from a lab's
 * runs. The effective barrier is floored at 0 eV (hopping at the attempt frequency).
 *
 * <p><b>Assumptions.</b> Complete condensation (no re-evaporation of adatoms), immobile stable clusters,
 * isotropic diffusion on one kind of site, saturation regime (coverage of order 0.1 ML or more). A mobile
 * dimer or strongly anisotropic diffusion changes the exponent (Villain et al., J. Phys. I France 2, 2107
 * (1992)); such cases are outside this law.
 *
 * @param diffusionBarrierEv     adatom hop barrier {@code E_d} in eV
 * @param attemptFrequencyHz     total attempt frequency {@code nu0} in Hz; positive
 * @param criticalSize           critical cluster size {@code i}, 1 to 3
 * @param bindingEnergyEv        binding energy {@code E_i} of the critical cluster in eV; ignored for i = 1
 * @param prefactor              dimensionless prefactor {@code eta}; positive
 * @param surfactantShiftEv      barrier shift at a full surfactant layer, eV
 * @param alpha                  {@link #ALPHA_2D} or {@link #ALPHA_3D}
 * @since 0.1
 */
public record NucleationLaw(double diffusionBarrierEv, double attemptFrequencyHz, int criticalSize,
                            double bindingEnergyEv, double prefactor, double surfactantShiftEv,
                            double alpha) {

    /** Boltzmann constant in eV/K, CODATA 2018 (exact in the 2019 SI). */
    public static final double BOLTZMANN_EV_PER_K = 8.617333262e-5;

    /** Exponent offset for two-dimensional islands, complete condensation (Venables 1984). */
    public static final double ALPHA_2D = 2.0;

    /** Exponent offset for three-dimensional islands and droplets, complete condensation (Venables 1984). */
    public static final double ALPHA_3D = 2.5;

    /**
     * Default adatom diffusion barrier, 0.7 eV: Ga on GaAs(001), 0.7 ± 0.1 eV from ring size against
     * crystallisation temperature, Wang et al., Chin. Phys. B 29, 046801 (2020).
     */
    public static final double DEFAULT_DIFFUSION_BARRIER_EV = 0.7;

    /** Default total attempt frequency, 1e13 Hz: a typical lattice vibration frequency (common practice). */
    public static final double DEFAULT_ATTEMPT_FREQUENCY_HZ = 1e13;

    /**
     * Default critical cluster size, 1: Ga droplets on GaAs show i = 1 to 2, Tuktamyshev et al.,
     * Sci. Rep. 11 (2021), doi 10.1038/s41598-021-86339-3.
     */
    public static final double DEFAULT_CRITICAL_SIZE = 1;

    /** Default critical-cluster binding energy, 0 eV: exact for i = 1 (a single adatom has no bonds). */
    public static final double DEFAULT_BINDING_ENERGY_EV = 0;

    /**
     * Default prefactor eta, 0.25: point islands with i = 1 at 0.1-0.2 ML, Bales and Chrzan, PRB 50, 6057
     * (1994); Amar, Family, Lam, PRB 50, 8781 (1994) (value from memory; 0.2-0.3 is the quoted range).
     */
    public static final double DEFAULT_PREFACTOR = 0.25;

    /** Default surfactant barrier shift, 0 eV: no general published value exists; fitted from the lab's runs. */
    public static final double DEFAULT_SURFACTANT_BARRIER_SHIFT = 0;

    /**
     * Surfactant coverage at which its effect on the barrier saturates, 1 ML: one floating layer (Copel et
     * al., PRL 63, 632 (1989), from memory).
     */
    public static final double SURFACTANT_SATURATION_ML = 1.0;

    /**
     * Bounds of the surfactant shift, ±0.5 eV: of the order of the adatom barriers themselves (0.1-1 eV),
     * so the fit can say either sign without reaching a bound (Terrace choice).
     */
    public static final double SURFACTANT_SHIFT_BOUND_EV = 0.5;

    /**
     * Smallest hop-to-deposition ratio {@code D/F} for which predictions are marked valid, 1e3. The law is
     * derived for {@code D/F >> 1}; kinetic Monte Carlo checks of it use about 1e5 and more (Amar, Family,
     * Lam 1994, from memory). At 1e3 islands already cover a few per cent of the sites (i = 1), where the
     * point-island picture stops working. The threshold is common practice, not a published value.
     */
    public static final double MIN_HOP_TO_DEPOSITION_RATIO = 1e3;

    /** Parameter name of {@code E_d}. */
    public static final String DIFFUSION_BARRIER = "diffusion_barrier";
    /** Parameter name of {@code nu0}. */
    public static final String ATTEMPT_FREQUENCY = "attempt_frequency";
    /** Parameter name of {@code i}. */
    public static final String CRITICAL_SIZE = "critical_size";
    /** Parameter name of {@code E_i}. */
    public static final String BINDING_ENERGY = "binding_energy";
    /** Parameter name of {@code eta}. */
    public static final String PREFACTOR = "prefactor";
    /** Parameter name of the surfactant barrier shift at a full layer, {@code surfactant_shift} (eV). */
    public static final String SURFACTANT_SHIFT = "surfactant_shift";
    /** The same parameter name as {@link #SURFACTANT_SHIFT}, kept for callers of earlier versions. */
    public static final String SURFACTANT_BARRIER_SHIFT = SURFACTANT_SHIFT;

    /**
     * Shared meaning of the surfactant shift: the models of one chain that use the surfactant fit one value.
     */
    public static final String MEANING_SURFACTANT_SHIFT = "surfactant_diffusion_shift";

    /** Checks the invariants. */
    public NucleationLaw {
        if (!Double.isFinite(diffusionBarrierEv) || !Double.isFinite(bindingEnergyEv)
                || !Double.isFinite(surfactantShiftEv)) {
            throw new IllegalArgumentException("energies must be finite");
        }
        if (!(attemptFrequencyHz > 0) || !(prefactor > 0) || Double.isInfinite(attemptFrequencyHz)
                || Double.isInfinite(prefactor)) {
            throw new IllegalArgumentException("attempt frequency and prefactor must be positive and finite");
        }
        if (criticalSize < 1 || criticalSize > 3) {
            throw new IllegalArgumentException("critical size must be 1, 2 or 3, got " + criticalSize);
        }
        if (alpha != ALPHA_2D && alpha != ALPHA_3D) {
            throw new IllegalArgumentException("alpha must be 2 (2D) or 2.5 (3D), got " + alpha);
        }
    }

    /**
     * Reads the law's parameters from a model's parameter values.
     *
     * @param values values for the six shared parameters named by this class' constants; never null
     * @param alpha  {@link #ALPHA_2D} or {@link #ALPHA_3D}
     * @return the law; never null
     * @throws IllegalArgumentException when a value is missing or out of range
     */
    public static NucleationLaw from(ParameterValues values, double alpha) {
        return new NucleationLaw(values.get(DIFFUSION_BARRIER), values.get(ATTEMPT_FREQUENCY),
                (int) Math.round(values.get(CRITICAL_SIZE)), values.get(BINDING_ENERGY), values.get(PREFACTOR),
                values.get(SURFACTANT_SHIFT), alpha);
    }

    /** Shared meaning of the adatom diffusion barrier: one value across the models of a chain. */
    public static final String MEANING_DIFFUSION_BARRIER = "adatom_diffusion_barrier";

    /** Shared meaning of the adatom attempt frequency: one value across the models of a chain. */
    public static final String MEANING_ATTEMPT_FREQUENCY = "adatom_attempt_frequency";

    /**
     * The six shared parameter definitions, with defaults, bounds and sources.
     *
     * @return the definitions in a fixed order; never null
     */
    public static List<ModelParameter> parameters() {
        return List.of(
                ModelParameter.continuous(DIFFUSION_BARRIER, "eV", DEFAULT_DIFFUSION_BARRIER_EV, 0.05, 2.0, false,
                        "Wang et al., Chin. Phys. B 29, 046801 (2020): Ga on GaAs(001), 0.7 ± 0.1 eV; bounds span "
                                + "published adatom barriers from about 0.1 eV (Ag/Ag(111)) to above 1 eV",
                        "adatom hop barrier E_d; D = (nu0/4)·exp(-E_d/kT)").withMeaning(MEANING_DIFFUSION_BARRIER),
                ModelParameter.continuous(ATTEMPT_FREQUENCY, "Hz", DEFAULT_ATTEMPT_FREQUENCY_HZ, 1e9, 1e15, true,
                        "common practice (lattice vibration frequency); published fits range about 1e11-1e14 Hz "
                                + "(Brune et al., PRB 52, R14380 (1995), from memory)",
                        "total attempt frequency nu0 out of a site").withMeaning(MEANING_ATTEMPT_FREQUENCY),
                ModelParameter.discrete(CRITICAL_SIZE, DEFAULT_CRITICAL_SIZE, List.of(1.0, 2.0, 3.0),
                        "Tuktamyshev et al., Sci. Rep. 11 (2021): i = 1-2 for Ga droplets on GaAs(111)A",
                        "critical cluster size i (the largest unstable cluster)"),
                ModelParameter.continuous(BINDING_ENERGY, "eV", DEFAULT_BINDING_ENERGY_EV, 0.0, 3.0, false,
                        "E_1 = 0 by definition for i = 1; for i > 1 no general value, fitted from the lab's runs",
                        "binding energy E_i of the critical cluster; ignored when critical_size = 1"),
                ModelParameter.continuous(PREFACTOR, "", DEFAULT_PREFACTOR, 0.01, 1.0, true,
                        "Bales & Chrzan, PRB 50, 6057 (1994); Amar, Family, Lam, PRB 50, 8781 (1994): about "
                                + "0.2-0.3 for i = 1 (value from memory)",
                        "dimensionless prefactor eta of the saturation density"),
                ModelParameter.continuous(SURFACTANT_SHIFT, "eV", DEFAULT_SURFACTANT_BARRIER_SHIFT,
                        -SURFACTANT_SHIFT_BOUND_EV, SURFACTANT_SHIFT_BOUND_EV, false,
                        "no general published value exists; fitted from the lab's runs (0 = no effect); either sign "
                                + "is seen (Massies and Grandjean, PRB 48, 8502 (1993)); saturates at one layer "
                                + "(Copel et al., PRL 63, 632 (1989), from memory)",
                        "change of the diffusion barrier at a full surfactant layer (linear below 1 ML, constant "
                                + "above); negative favours step flow").withMeaning(MEANING_SURFACTANT_SHIFT));
    }

    /**
     * The scaling exponent {@code chi = i / (i + alpha)}.
     *
     * @return chi, between 0.28 and 0.6
     */
    public double exponent() {
        return criticalSize / (criticalSize + alpha);
    }

    /**
     * The diffusion barrier after the surfactant shift, floored at zero.
     *
     * @param surfactantMl surfactant pre-coverage in ML, zero when none
     * @return the effective barrier in eV, never negative
     */
    public double effectiveBarrierEv(double surfactantMl) {
        return Math.max(0.0, rawEffectiveBarrierEv(surfactantMl));
    }

    /**
     * The diffusion barrier after the surfactant shift, before flooring.
     *
     * @param surfactantMl surfactant pre-coverage in ML, not negative
     * @return {@code E_d + shift·min(θ_s/1 ML, 1)} in eV
     */
    public double rawEffectiveBarrierEv(double surfactantMl) {
        return diffusionBarrierEv + surfactantShiftEv * surfactantFraction(surfactantMl);
    }

    /**
     * The part of the full-layer shift that a surfactant pre-coverage applies: linear up to
     * {@link #SURFACTANT_SATURATION_ML}, then 1.
     *
     * @param surfactantMl surfactant pre-coverage in ML; zero or negative gives 0
     * @return a fraction in [0, 1]
     */
    public static double surfactantFraction(double surfactantMl) {
        if (!(surfactantMl > 0)) {
            return 0.0;
        }
        return Math.min(surfactantMl / SURFACTANT_SATURATION_ML, 1.0);
    }

    /**
     * Natural logarithm of the hop rate per site, {@code ln((nu0/4)·exp(−E_d,eff/kT))}.
     *
     * @param temperatureK substrate temperature in K; positive
     * @param surfactantMl surfactant pre-coverage in ML
     * @return ln D with D in s^-1
     */
    public double lnHopRate(double temperatureK, double surfactantMl) {
        return Math.log(attemptFrequencyHz / 4.0)
                - effectiveBarrierEv(surfactantMl) / (BOLTZMANN_EV_PER_K * temperatureK);
    }

    /**
     * The critical-cluster term's energy, {@code E_i/(i+alpha)}, zero for i = 1.
     *
     * @return the energy in eV
     */
    public double clusterTermEv() {
        return criticalSize == 1 ? 0.0 : bindingEnergyEv / (criticalSize + alpha);
    }

    /**
     * Natural logarithm of the saturation density per site, {@code ln(N/N0)}; can exceed 0 when the law
     * is pushed outside its range (callers flag that and cap the density).
     *
     * @param rateMlPerS   deposition rate F in ML/s; positive
     * @param temperatureK substrate temperature in K; positive
     * @param surfactantMl surfactant pre-coverage in ML
     * @return ln(N/N0), finite
     */
    public double lnDensityPerSite(double rateMlPerS, double temperatureK, double surfactantMl) {
        double lnFOverD = Math.log(rateMlPerS) - lnHopRate(temperatureK, surfactantMl);
        return Math.log(prefactor) + exponent() * lnFOverD + clusterTermEv() / (BOLTZMANN_EV_PER_K * temperatureK);
    }

    /**
     * The Arrhenius energy of the density, {@code E = chi·E_d,eff + E_i/(i+alpha)}, so that
     * {@code N ∝ exp(E/kT)}; for 2D islands this is {@code (E_i + i·E_d)/(i+2)}.
     *
     * @param surfactantMl surfactant pre-coverage in ML
     * @return E in eV, never negative
     */
    public double arrheniusEnergyEv(double surfactantMl) {
        return exponent() * effectiveBarrierEv(surfactantMl) + clusterTermEv();
    }
}
