package dev.terrace.core.material;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The material table: III-V compounds (with ternary alloys by Vegard's law), droplet metals and
 * group-V elements. Every value names its source.
 *
 * @since 0.1
 */
public final class Materials {

    /** Source of the lattice constants. */
    public static final String VURGAFTMAN_2001 =
            "Vurgaftman, Meyer, Ram-Mohan, J. Appl. Phys. 89, 5815 (2001), Table of III-V lattice constants at 300 K";

    /**
     * Lowest temperature at which Ga droplets are taken as a supercooled liquid, 150 K: the metastability
     * limit of supercooled liquid Ga, Bosio and Windsor, Phys. Rev. Lett. 35, 1652 (1975).
     */
    public static final double GA_SUPERCOOLING_LIMIT_K = 150.0;

    private static final Map<String, Compound> COMPOUNDS = new LinkedHashMap<>();
    private static final Map<String, Metal> METALS = new LinkedHashMap<>();
    private static final Map<String, Double> GROUP_V_MASS = new LinkedHashMap<>();
    private static final Map<String, Integer> GROUP_V_ELECTRONS = new LinkedHashMap<>();

    static {
        compound("GaAs", 5.65325, 3.88e-5, "Ga", "As");
        compound("AlAs", 5.6611, 2.90e-5, "Al", "As");
        compound("InAs", 6.0583, 2.74e-5, "In", "As");
        compound("GaSb", 6.0959, 4.72e-5, "Ga", "Sb");
        compound("InP", 5.8697, 2.79e-5, "In", "P");
        compound("InSb", 6.4794, 3.48e-5, "In", "Sb");
        // Melting points: ITS-90 fixed points (Preston-Thomas, Metrologia 27, 3 (1990)) for Ga, In and Al.
        // Liquid densities near the melting point and molar masses: CRC Handbook of Chemistry and Physics
        // (values from memory; molar masses are IUPAC standard atomic weights).
        // Supercooling limits: liquid Ga droplets supercool down to a metastability limit of 150 K (Bosio and
        // Windsor, Phys. Rev. Lett. 35, 1652 (1975), micrometre droplets in an emulsion; Parravicini et al.,
        // Appl. Phys. Lett. 89, 033123 (2006) report 3-15 nm Ga particles liquid down to 90 K). For In and Al no
        // margin is used: In islands on GaAs(111)A behave as solid just below the melting point (Tuktamyshev
        // et al., Nanomaterials 10, 1512 (2020)), and no supercooling of Al droplets on III-V surfaces was found.
        METALS.put("Ga", new Metal("Ga", 302.9146, 6.095, 69.723, 31, GA_SUPERCOOLING_LIMIT_K,
                "melting point ITS-90 (Preston-Thomas 1990); liquid density 6.095 g/cm3, CRC Handbook (from memory); "
                        + "supercooled liquid down to 150 K (Bosio and Windsor, Phys. Rev. Lett. 35, 1652 (1975))"));
        METALS.put("In", new Metal("In", 429.7485, 7.02, 114.818, 49, 429.7485,
                "melting point ITS-90 (Preston-Thomas 1990); liquid density 7.02 g/cm3, CRC Handbook (from memory); "
                        + "no supercooling margin (In islands solid below the melting point, Tuktamyshev et al. 2020)"));
        METALS.put("Al", new Metal("Al", 933.473, 2.375, 26.9815385, 13, 933.473,
                "melting point ITS-90 (Preston-Thomas 1990); liquid density 2.375 g/cm3, CRC Handbook (from memory); "
                        + "no supercooling margin (none published for Al droplets on III-V surfaces)"));
        // IUPAC standard atomic weights; atomic numbers.
        GROUP_V_MASS.put("As", 74.921595);
        GROUP_V_MASS.put("Sb", 121.760);
        GROUP_V_MASS.put("P", 30.973762);
        GROUP_V_ELECTRONS.put("As", 33);
        GROUP_V_ELECTRONS.put("Sb", 51);
        GROUP_V_ELECTRONS.put("P", 15);
    }

    private static final Pattern TERNARY =
            Pattern.compile("([A-Z][a-z]?)(0?\\.\\d+|1(?:\\.0*)?|0)([A-Z][a-z]?)(0?\\.\\d+|1(?:\\.0*)?|0)?([A-Z][a-z]?)");

    private Materials() {
    }

    private static void compound(String name, double a, double c, String iii, String v) {
        COMPOUNDS.put(name, new Compound(name, a, c, iii, v, VURGAFTMAN_2001));
    }

    /** @return the names of the binary compounds in the table; never null */
    public static Set<String> compoundNames() {
        return Collections.unmodifiableSet(COMPOUNDS.keySet());
    }

    /** @return the droplet metals in the table; never null */
    public static Set<String> metalNames() {
        return Collections.unmodifiableSet(METALS.keySet());
    }

    /** @return the group-V elements in the table; never null */
    public static Set<String> groupVNames() {
        return Collections.unmodifiableSet(GROUP_V_MASS.keySet());
    }

    /**
     * Looks up a substrate: a binary from the table or a ternary alloy such as
     * {@code In0.3Ga0.7As}, whose lattice constant follows Vegard's law.
     *
     * @param name the formula
     * @return the compound, or empty when it cannot be resolved
     */
    public static Optional<Compound> compound(String name) {
        Compound c = COMPOUNDS.get(name);
        if (c != null) {
            return Optional.of(c);
        }
        Matcher m = TERNARY.matcher(name);
        if (!m.matches()) {
            return Optional.empty();
        }
        String a = m.group(1);
        double x = Double.parseDouble(m.group(2));
        String b = m.group(3);
        String v = m.group(5);
        double y = m.group(4) == null ? 1 - x : Double.parseDouble(m.group(4));
        if (Math.abs(x + y - 1) > 1e-9 || x < 0 || x > 1) {
            return Optional.empty();
        }
        Compound ca = COMPOUNDS.get(a + v);
        Compound cb = COMPOUNDS.get(b + v);
        if (ca == null || cb == null) {
            return Optional.empty();
        }
        return Optional.of(vegard(name, ca, cb, x));
    }

    /**
     * Vegard's law: a linear interpolation of lattice constant and its thermal coefficient.
     *
     * @param name name of the alloy
     * @param a    first binary (fraction x)
     * @param b    second binary (fraction 1 - x)
     * @param x    fraction of the first binary
     * @return the alloy; never null
     */
    public static Compound vegard(String name, Compound a, Compound b, double x) {
        return new Compound(name, x * a.a300() + (1 - x) * b.a300(), x * a.dadT() + (1 - x) * b.dadT(),
                a.groupIII() + "/" + b.groupIII(), a.groupV(),
                "Vegard's law between " + a.name() + " and " + b.name() + "; " + VURGAFTMAN_2001);
    }

    /**
     * @param symbol a metal symbol
     * @return the metal, or empty
     */
    public static Optional<Metal> metal(String symbol) {
        return Optional.ofNullable(METALS.get(symbol));
    }

    /**
     * The compound a deposited metal forms when it crystallises under a group-V flux, for example GaAs from
     * Ga and As.
     *
     * @param metal  the metal symbol, or null
     * @param groupV the group-V element symbol, or null
     * @return the binary compound from the table, or empty when either is missing or the binary is not listed
     */
    public static Optional<Compound> crystal(String metal, String groupV) {
        if (metal == null || groupV == null) {
            return Optional.empty();
        }
        return Optional.ofNullable(COMPOUNDS.get(metal + groupV));
    }

    /**
     * @param element a group-V element symbol
     * @return its molar mass in g/mol (IUPAC standard atomic weight), or empty
     */
    public static Optional<Double> groupVMolarMass(String element) {
        return Optional.ofNullable(GROUP_V_MASS.get(element));
    }

    /**
     * @param element a group-V element symbol
     * @return its atomic number, or empty
     */
    public static Optional<Integer> groupVElectrons(String element) {
        return Optional.ofNullable(GROUP_V_ELECTRONS.get(element));
    }
}
