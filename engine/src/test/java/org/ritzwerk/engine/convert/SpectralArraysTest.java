package org.ritzwerk.engine.convert;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.lists;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/**
 * The bulk kernel agrees with the typed quantities (whose physics the api module checks against
 * golden values computed in mpmath, the air/vacuum ones from the published refractive-index
 * formulas) on seeded random columns, and names the element it refuses.
 */
class SpectralArraysTest {

    private static final long SEED = 4096L;
    private static final List<Unit> SPECTRAL_UNITS = List.of(Unit.NANOMETRE, Unit.ANGSTROM, Unit.MICROMETRE,
            Unit.PER_CENTIMETRE, Unit.TERAHERTZ, Unit.GIGAHERTZ, Unit.ELECTRONVOLT, Unit.JOULE);
    private static final List<Medium> MEDIA = List.of(Medium.vacuum(), Medium.air(),
            Medium.air(new Ciddor1996(20, 101_325, 40, 450)));

    @Test
    void bulkEqualsTypedConversionsTo1e15() {
        qt().withFixedSeed(SEED)
                .forAll(lists().of(doubles().between(310, 1680)).ofSizeBetween(1, 50),
                        arbitrary().pick(MEDIA), arbitrary().pick(SPECTRAL_UNITS), arbitrary().pick(MEDIA))
                .checkAssert((nanometres, fromMedium, to, toMedium) -> {
                    double[] values = nanometres.stream().mapToDouble(Double::doubleValue).toArray();
                    double[] out = new double[values.length];
                    SpectralArrays.convert(values, Unit.NANOMETRE, fromMedium, to, toMedium, out);
                    for (int i = 0; i < values.length; i++) {
                        SpectralQuantity typed = Wavelength.ofNanometres(values[i], fromMedium).to(to, toMedium);
                        double expected = typed.valueIn(to);
                        assertEquals(expected, out[i], 1e-15 * expected, () -> typed + " in " + to);
                    }
                });
    }

    @Test
    void everyUnitPairAgreesWithTheTypedPath() {
        // From every spectral unit (vacuum) to every other, over seeded random photon energies.
        qt().withFixedSeed(SEED).forAll(doubles().between(-3, 2), arbitrary().pick(SPECTRAL_UNITS),
                arbitrary().pick(SPECTRAL_UNITS)).checkAssert((exponent, from, to) -> {
                    SpectralQuantity source = org.ritzwerk.quantity.Energy.ofElectronVolts(Math.pow(10, exponent))
                            .to(from, Medium.vacuum());
                    double[] out = new double[1];
                    SpectralArrays.convert(new double[] {source.valueIn(from)}, from, Medium.vacuum(), to,
                            Medium.vacuum(), out);
                    double expected = source.to(to, Medium.vacuum()).valueIn(to);
                    assertEquals(expected, out[0], 1e-15 * expected, () -> source + " to " + to);
                });
    }

    @Test
    void convertsInPlace() {
        double[] values = {500, 600, 700};
        SpectralArrays.convert(values, Unit.NANOMETRE, Medium.vacuum(), Unit.PER_CENTIMETRE, null, values);
        assertEquals(20000, values[0], 1e-9);
        assertEquals(1e7 / 700, values[2], 1e-9);
    }

    @Test
    void namesTheBadElement() {
        double[] values = {500, 600, Double.NaN, 700};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SpectralArrays.convert(
                values, Unit.NANOMETRE, Medium.vacuum(), Unit.ELECTRONVOLT, null, new double[4]));
        assertEquals("element 2: NaN nm is not a finite positive spectral position", e.getMessage());
        MediumException outside = assertThrows(MediumException.class, () -> SpectralArrays.convert(
                new double[] {500, 150}, Unit.NANOMETRE, Medium.air(), Unit.NANOMETRE, Medium.vacuum(),
                new double[2]));
        assertTrue(outside.getMessage().startsWith("element 1: wavelength 150 nm (air) is outside"),
                outside.getMessage());
        // one value alone: its caller names where it came from (a file's line and column)
        MediumException one = assertThrows(MediumException.class, () -> SpectralArrays.convert(
                new double[] {150}, Unit.NANOMETRE, Medium.air(), Unit.NANOMETRE, Medium.vacuum(), new double[1]));
        assertTrue(one.getMessage().startsWith("wavelength 150 nm (air) is outside"), one.getMessage());
    }

    @Test
    void refusesMismatchedArguments() {
        assertThrows(IllegalArgumentException.class, () -> SpectralArrays.convert(new double[2], Unit.NANOMETRE,
                Medium.vacuum(), Unit.ELECTRONVOLT, null, new double[3]));
        assertThrows(NullPointerException.class, () -> SpectralArrays.convert(new double[1], Unit.NANOMETRE,
                null, Unit.ELECTRONVOLT, null, new double[1]));
        assertThrows(IllegalArgumentException.class, () -> SpectralArrays.convert(new double[1], Unit.KELVIN,
                null, Unit.ELECTRONVOLT, null, new double[1]));
        assertEquals(Kind.TEMPERATURE, Unit.KELVIN.kind());
    }
}
