package dev.terrace.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * An invented InAs/GaAs(001) Stranski-Krastanov dot series: a made-up ground truth, a grower's plan and
 * the run log it gives. Every number here is invented for Terrace's second demo; none is a measurement.
 *
 * <p>The truth is independent of the {@code critical-thickness} plugin's code: the local InAs coverage
 * varies across the sample by a Gaussian {@link #COVERAGE_SPREAD_ML}; dots appear where it passes
 * {@link #TRUE_CRITICAL_ML} and their density rises as {@code (θ − θc)^}{@value #TRUE_EXPONENT} times a
 * density at 1 ML past the onset that falls with temperature and rises with rate,
 * {@code N1 = N_REF · (F/F_REF)^RATE_EXPONENT · exp(E_N/k_B · (1/T − 1/T_REF))}; the measured density
 * scatters lognormally by {@link #DENSITY_SCATTER}. Densities below the invented AFM detection limit
 * {@link #DETECTION_PER_CM2} are written {@code <1e8}; the RHEED class is {@code dots} where the local
 * coverage passed the onset, otherwise {@code wetting-layer}.
 *
 * @since 0.3
 */
public final class SkDotChamber {

    /** Seed of the bundled series, 20260309 (the date of its first invented run). */
    public static final long SEED = 20260309L;
    /** Invented true critical thickness, 1.64 ML. */
    public static final double TRUE_CRITICAL_ML = 1.64;
    /** Invented true exponent of the rise past the onset, 1.7. */
    public static final double TRUE_EXPONENT = 1.7;
    /** Invented density 1 ML past the onset at the reference conditions, 3e10 cm^-2. */
    public static final double N_REF_PER_CM2 = 3e10;
    /** Reference rate of the invented truth, 0.05 ML/s. */
    public static final double F_REF_ML_PER_S = 0.05;
    /** Reference temperature of the invented truth, 773.15 K (500 °C). */
    public static final double T_REF_K = 773.15;
    /** Invented rate exponent of the density, 0.5. */
    public static final double RATE_EXPONENT = 0.5;
    /** Invented Arrhenius energy of the density, 0.9 eV. */
    public static final double DENSITY_ENERGY_EV = 0.9;
    /** Invented spread of the local coverage across a sample, 0.03 ML. */
    public static final double COVERAGE_SPREAD_ML = 0.03;
    /** Invented lognormal scatter of the measured density, 0.2 in ln. */
    public static final double DENSITY_SCATTER = 0.2;
    /** Invented AFM detection limit, 1e8 cm^-2. */
    public static final double DETECTION_PER_CM2 = 1e8;
    /** Boltzmann constant in eV/K, CODATA 2018 (exact in the 2019 SI). */
    static final double KB_EV_PER_K = 8.617333262e-5;

    /** One planned run: substrate temperature (°C), InAs rate (ML/s), InAs amount (ML) and a note. */
    record Plan(double tC, double rate, double amount, String note) {
    }

    /** The invented grower's plan: a coverage series at 500 °C and 0.05 ML/s, then temperature and rate. */
    static final List<Plan> PLAN = List.of(
            new Plan(500, 0.05, 1.30, "coverage series, wetting layer expected"),
            new Plan(500, 0.05, 1.50, "coverage series"),
            new Plan(500, 0.05, 1.60, "coverage series"),
            new Plan(500, 0.05, 1.70, "coverage series, RHEED turned spotty near the end"),
            new Plan(500, 0.05, 1.75, "coverage series, closer to the onset"),
            new Plan(500, 0.05, 1.80, "coverage series"),
            new Plan(500, 0.05, 1.90, "coverage series, closer to the onset"),
            new Plan(500, 0.05, 2.00, "coverage series"),
            new Plan(500, 0.05, 2.30, "coverage series"),
            new Plan(500, 0.05, 2.60, "coverage series"),
            new Plan(480, 0.05, 2.10, "colder"),
            new Plan(520, 0.05, 2.10, "hotter"),
            new Plan(500, 0.02, 2.10, "slower"),
            new Plan(500, 0.15, 2.10, "faster"),
            new Plan(490, 0.10, 1.55, "just below the onset?"),
            new Plan(510, 0.03, 1.90, "between the series"));

    private SkDotChamber() {
    }

    /**
     * The invented true density for a local coverage, before scatter.
     *
     * @param tK        substrate temperature in K
     * @param rate      InAs rate in ML/s
     * @param coverage  local InAs coverage in ML
     * @return the density in cm^-2, zero below the onset
     */
    static double trueDensity(double tK, double rate, double coverage) {
        if (coverage <= TRUE_CRITICAL_ML) {
            return 0;
        }
        double n1 = N_REF_PER_CM2 * Math.pow(rate / F_REF_ML_PER_S, RATE_EXPONENT)
                * Math.exp(DENSITY_ENERGY_EV / KB_EV_PER_K * (1 / tK - 1 / T_REF_K));
        return n1 * Math.pow(coverage - TRUE_CRITICAL_ML, TRUE_EXPONENT);
    }

    /**
     * The bundled run log's text.
     *
     * @param seed the seed of the scatter
     * @return the CSV text, with a header comment saying the data are invented; never null
     */
    public static String runLog(long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        StringBuilder sb = new StringBuilder();
        sb.append("# INVENTED DATA generated by Terrace's SK dot series generator (seed ").append(seed)
                .append("); not measurements.\n");
        sb.append("# Campaign 'sk-dots-demo': every number below comes from a made-up ground truth, not from a lab.\n");
        // the (empty) proposal column, as in the droplet demo: a run grown from a proposal names it
        // there (terrace record --proposal fills it), and check's track record follows it
        sb.append("run_id,t_sub,inas_rate,inas_amount,dot_density,rheed,status,date,proposal,notes\n");
        List<String> rows = new ArrayList<>();
        java.time.LocalDate date = java.time.LocalDate.of(2026, 3, 9);
        for (int i = 0; i < PLAN.size(); i++) {
            Plan p = PLAN.get(i);
            double tK = p.tC() + 273.15;
            double local = p.amount() + COVERAGE_SPREAD_ML * rng.nextGaussian();
            double n = trueDensity(tK, p.rate(), local) * Math.exp(DENSITY_SCATTER * rng.nextGaussian());
            String density = n >= DETECTION_PER_CM2 ? String.format(Locale.ROOT, "%.2e", n).replace("e+0", "e").replace("e+", "e")
                    : "<1e8";
            String rheed = local > TRUE_CRITICAL_ML ? "dots" : "wetting-layer";
            rows.add(String.format(Locale.ROOT, "K%02d,%s,%s,%s,%s,%s,ok,%s,,%s", i + 1, plain(p.tC()), plain(p.rate()),
                    plain(p.amount()), density, rheed, date, p.note().contains(",") ? '"' + p.note() + '"' : p.note()));
            date = date.plusDays(date.getDayOfWeek() == java.time.DayOfWeek.FRIDAY ? 3 : 1);
        }
        rows.forEach(r -> sb.append(r).append('\n'));
        return sb.toString();
    }

    private static String plain(double v) {
        return new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
    }

    /**
     * Prints the bundled run log to standard output; after changing the truth, run
     * {@code java dev.terrace.demo.SkDotChamber > datasets-demo/src/main/resources/dev/terrace/demo/sk-dots/runs.csv}.
     *
     * @param args ignored
     */
    public static void main(String[] args) {
        System.out.print(runLog(SEED));
        System.out.flush();
    }
}
