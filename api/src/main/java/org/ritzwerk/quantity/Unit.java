package org.ritzwerk.quantity;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The units Ritzwerk reads and writes, each of one {@link Kind}.
 *
 * <p>A unit converts to and from its kind's canonical SI unit. Decimal sub-multiples of the metre
 * divide by an exact power of ten ({@code 656.28 nm = 656.28 / 1e9 m}), multiples multiply by
 * one; both are a single correctly rounded operation. The electronvolt uses the exact elementary
 * charge of the SI (2019). Symbols are case-sensitive ({@code MHz} is not {@code mHz}).
 */
public enum Unit {
    /** Metre. */
    METRE("m", Kind.WAVELENGTH, 1, false),
    /** Micrometre; also read as {@code µm}. */
    MICROMETRE("um", Kind.WAVELENGTH, 1e6, true, "\u00b5m", "\u03bcm"),
    /** Nanometre. */
    NANOMETRE("nm", Kind.WAVELENGTH, 1e9, true),
    /** Ångström, 1e-10 m, printed as U+00C5; also read as U+212B, {@code Angstrom}, {@code angstrom}. */
    ANGSTROM("\u00c5", Kind.WAVELENGTH, 1e10, true, "\u212b", "Angstrom", "angstrom"),
    /** Inverse metre. */
    PER_METRE("m-1", Kind.WAVENUMBER, 1, false, "m^-1", "/m", "m\u207b\u00b9"),
    /** Inverse centimetre, the spectroscopist's wavenumber unit. */
    PER_CENTIMETRE("cm-1", Kind.WAVENUMBER, 100, false, "cm^-1", "/cm", "cm\u207b\u00b9"),
    /** Hertz. */
    HERTZ("Hz", Kind.FREQUENCY, 1, false),
    /** Kilohertz. */
    KILOHERTZ("kHz", Kind.FREQUENCY, 1e3, false),
    /** Megahertz. */
    MEGAHERTZ("MHz", Kind.FREQUENCY, 1e6, false),
    /** Gigahertz. */
    GIGAHERTZ("GHz", Kind.FREQUENCY, 1e9, false),
    /** Terahertz. */
    TERAHERTZ("THz", Kind.FREQUENCY, 1e12, false),
    /** Joule. */
    JOULE("J", Kind.ENERGY, 1, false),
    /** Electronvolt, exactly 1.602176634e-19 J. */
    ELECTRONVOLT("eV", Kind.ENERGY, 1.602176634e-19, false),
    /** Millielectronvolt, exactly 1.602176634e-22 J. */
    MILLIELECTRONVOLT("meV", Kind.ENERGY, 1.602176634e-22, false),
    /** Kelvin. */
    KELVIN("K", Kind.TEMPERATURE, 1, false);

    private static final Map<String, Unit> BY_SYMBOL = new LinkedHashMap<>();

    static {
        for (Unit unit : values()) {
            BY_SYMBOL.put(unit.symbol, unit);
            for (String alias : unit.aliases) {
                BY_SYMBOL.put(alias, unit);
            }
        }
    }

    private final String symbol;
    private final Kind kind;
    private final double factor;
    private final boolean divides;
    private final List<String> aliases;

    Unit(String symbol, Kind kind, double factor, boolean divides, String... aliases) {
        this.symbol = symbol;
        this.kind = kind;
        this.factor = factor;
        this.divides = divides;
        this.aliases = List.of(aliases);
    }

    /** @return the symbol Ritzwerk prints, e.g. {@code nm}, {@code cm-1}, {@code Å} */
    public String symbol() {
        return symbol;
    }

    /** @return the other spellings the parser accepts for this unit (may be empty) */
    public List<String> aliases() {
        return aliases;
    }

    /** @return the kind of quantity this unit measures */
    public Kind kind() {
        return kind;
    }

    /**
     * @param value a value in this unit
     * @return the value in the kind's canonical SI unit (m, m^-1, Hz, J or K)
     */
    public double toSi(double value) {
        return divides ? value / factor : value * factor;
    }

    /**
     * @param si a value in the kind's canonical SI unit
     * @return the value in this unit
     */
    public double fromSi(double si) {
        return divides ? si * factor : si / factor;
    }

    /**
     * @param symbol a unit symbol or accepted alias, case-sensitive
     * @return the unit, or empty when the symbol is not known
     */
    public static Optional<Unit> fromSymbol(String symbol) {
        return Optional.ofNullable(BY_SYMBOL.get(symbol));
    }

    /** @return every symbol the parser reads (printed symbols first), in a fixed order */
    public static List<String> knownSymbols() {
        List<String> symbols = new ArrayList<>();
        for (Unit unit : values()) {
            symbols.add(unit.symbol);
        }
        return Collections.unmodifiableList(symbols);
    }

    void requireKind(Kind expected) {
        if (kind != expected) {
            throw new IllegalArgumentException("unit " + symbol + " measures a " + kind.noun() + ", not a "
                    + expected.noun());
        }
    }
}
