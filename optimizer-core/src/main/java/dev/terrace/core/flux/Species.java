package dev.terrace.core.flux;

import dev.terrace.core.material.Materials;
import dev.terrace.core.material.Metal;

import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * A molecular species in a molecular beam: the group-V molecules a cell or cracker emits and
 * the group-III atoms from an effusion cell.
 *
 * <p>Constant names are the usual chemical spellings ({@code As4}, {@code Ga}), so that
 * {@link #name()} and {@link #toString()} give what a grower writes in a run log.
 *
 * <p>Molar masses are the IUPAC standard atomic weights (taken from {@link Materials}) times
 * the atoms per molecule; electron counts are atomic numbers times the atoms per molecule.
 *
 * <p>Each species carries a default source temperature, used only when the grower does not
 * give one. These are [practice] values: typical bulk-zone temperatures of sublimation cells
 * for the tetramers, cracker-zone temperatures for the dimers and monomers, and effusion-cell
 * temperatures for about 1 ML/s of the group-III metals. They vary by several tens of kelvin
 * from system to system; since a beam's mean speed goes as the square root of the source
 * temperature, 10 % in temperature moves a flux estimate by about 5 %.
 *
 * @since 0.1
 */
public enum Species {
    /** Arsenic monomer; default cracker-zone temperature 1173 K [practice]. */
    As("As", 1, Group.V, Species.CRACKER_K),
    /** Arsenic dimer from a cracker; default cracker-zone temperature 1173 K [practice]. */
    As2("As", 2, Group.V, Species.CRACKER_K),
    /** Arsenic tetramer from a sublimation cell; default bulk temperature 600 K [practice]. */
    As4("As", 4, Group.V, 600.0),
    /** Antimony monomer; default cracker-zone temperature 1173 K [practice]. */
    Sb("Sb", 1, Group.V, Species.CRACKER_K),
    /** Antimony dimer from a cracker; default cracker-zone temperature 1173 K [practice]. */
    Sb2("Sb", 2, Group.V, Species.CRACKER_K),
    /**
     * Antimony tetramer from a sublimation cell; default bulk temperature 723 K [practice].
     * Antimony is much less volatile than arsenic, so its cells run hotter than As cells.
     */
    Sb4("Sb", 4, Group.V, 723.0),
    /** Phosphorus dimer from a cracker; default cracker-zone temperature 1173 K [practice]. */
    P2("P", 2, Group.V, Species.CRACKER_K),
    /** Phosphorus tetramer from a sublimation cell; default bulk temperature 600 K [practice]. */
    P4("P", 4, Group.V, 600.0),
    /** Gallium from an effusion cell; default cell temperature 1200 K [practice]. */
    Ga("Ga", 1, Group.III, 1200.0),
    /** Indium from an effusion cell; default cell temperature 1100 K [practice]. */
    In("In", 1, Group.III, 1100.0),
    /** Aluminium from an effusion cell; default cell temperature 1373 K [practice]. */
    Al("Al", 1, Group.III, 1373.0);

    /** The column of the periodic table a species belongs to. */
    public enum Group {
        /** Group III (Al, Ga, In). */
        III,
        /** Group V (P, As, Sb). */
        V
    }

    /**
     * Default cracker-zone temperature in K for cracked group-V species [practice]: crackers
     * are usually run at about 1100-1200 K (roughly 850-950 degC).
     */
    public static final double CRACKER_K = 1173.0;

    private final String element;
    private final int atoms;
    private final Group group;
    private final double defaultSourceTemperatureK;
    private final int electrons;
    private final double molarMass;

    Species(String element, int atoms, Group group, double defaultSourceTemperatureK) {
        this.element = element;
        this.atoms = atoms;
        this.group = group;
        this.defaultSourceTemperatureK = defaultSourceTemperatureK;
        if (group == Group.V) {
            this.electrons = atoms * Materials.groupVElectrons(element).orElseThrow();
            this.molarMass = atoms * Materials.groupVMolarMass(element).orElseThrow();
        } else {
            Metal metal = Materials.metal(element).orElseThrow();
            this.electrons = atoms * metal.electrons();
            this.molarMass = atoms * metal.molarMass();
        }
    }

    /** @return the element symbol, for example {@code "As"} for {@link #As4}; never null */
    public String element() {
        return element;
    }

    /** @return the number of atoms per molecule, 1, 2 or 4 */
    public int atoms() {
        return atoms;
    }

    /** @return whether this is a group-III or a group-V species; never null */
    public Group group() {
        return group;
    }

    /** @return true for the group-V species (P, As, Sb molecules) */
    public boolean isGroupV() {
        return group == Group.V;
    }

    /** @return the total number of electrons per molecule, Z (atomic number times atoms) */
    public int electrons() {
        return electrons;
    }

    /** @return the molar mass of one molecule in g/mol (IUPAC standard atomic weight times atoms) */
    public double molarMass() {
        return molarMass;
    }

    /**
     * @return the source temperature in K assumed when the grower gives none; a [practice]
     *         default, see the class description
     */
    public double defaultSourceTemperatureK() {
        return defaultSourceTemperatureK;
    }

    /** @return the usual spelling, for example {@code "As4"}; never null */
    public String symbol() {
        return name();
    }

    /**
     * Reads a species from its usual spelling. The match is case-sensitive ({@code "As4"},
     * not {@code "AS4"}), because chemical symbols are; surrounding blanks are ignored.
     *
     * @param text the spelling, for example {@code "As4"} or {@code "Ga"}
     * @return the species; never null
     * @throws IllegalArgumentException when the text names no species; the message lists the valid names
     */
    public static Species parse(String text) {
        String t = text == null ? "" : text.strip();
        for (Species s : values()) {
            if (s.name().equals(t)) {
                return s;
            }
        }
        String hint = "";
        for (Species s : values()) {
            if (s.name().equalsIgnoreCase(t)) {
                hint = " (did you mean " + s.name() + "?)";
            }
        }
        throw new IllegalArgumentException("unknown beam species '" + t + "'" + hint
                + "; valid names (case-sensitive): " + validNames());
    }

    /** @return the valid spellings, comma-separated, in table order; never null */
    public static String validNames() {
        return Arrays.stream(values()).map(Species::name).collect(Collectors.joining(", "));
    }
}
