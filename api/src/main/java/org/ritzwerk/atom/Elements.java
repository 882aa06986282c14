package org.ritzwerk.atom;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The chemical elements by atomic number, with their IUPAC symbols (Z = 1 to 118; common
 * practice). Stateless and thread-safe.
 */
public final class Elements {

    /** The largest atomic number known here. */
    public static final int MAX_Z = 118;

    private static final List<String> SYMBOLS = List.of(
            "H", "He", "Li", "Be", "B", "C", "N", "O", "F", "Ne", "Na", "Mg",
            "Al", "Si", "P", "S", "Cl", "Ar", "K", "Ca", "Sc", "Ti", "V", "Cr",
            "Mn", "Fe", "Co", "Ni", "Cu", "Zn", "Ga", "Ge", "As", "Se", "Br", "Kr",
            "Rb", "Sr", "Y", "Zr", "Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd",
            "In", "Sn", "Sb", "Te", "I", "Xe", "Cs", "Ba", "La", "Ce", "Pr", "Nd",
            "Pm", "Sm", "Eu", "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu", "Hf",
            "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg", "Tl", "Pb", "Bi", "Po",
            "At", "Rn", "Fr", "Ra", "Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm",
            "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr", "Rf", "Db", "Sg", "Bh", "Hs",
            "Mt", "Ds", "Rg", "Cn", "Nh", "Fl", "Mc", "Lv", "Ts", "Og");

    private static final Map<String, Integer> BY_SYMBOL = new HashMap<>();

    static {
        for (int i = 0; i < SYMBOLS.size(); i++) {
            BY_SYMBOL.put(SYMBOLS.get(i), i + 1);
        }
    }

    private Elements() {
    }

    /**
     * @param z atomic number, 1 to {@link #MAX_Z}
     * @return the element symbol, e.g. {@code "He"}
     * @throws IllegalArgumentException for an atomic number outside 1 to 118
     */
    public static String symbol(int z) {
        if (z < 1 || z > MAX_Z) {
            throw new IllegalArgumentException("atomic number must be 1 to " + MAX_Z + ", got " + z);
        }
        return SYMBOLS.get(z - 1);
    }

    /**
     * @param symbol an element symbol, case-sensitive ({@code "He"}, not {@code "HE"})
     * @return the atomic number, or empty for an unknown symbol
     */
    public static Optional<Integer> atomicNumber(String symbol) {
        return Optional.ofNullable(BY_SYMBOL.get(symbol));
    }
}
