package org.ritzwerk.quantity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;

/**
 * Identities of the quantities, tried on seeded random inputs with QuickTheories (a failure
 * prints the falsifying values and the seed): conversion round trips, first-order uncertainty
 * propagation, and text round trips.
 */
class QuantityPropertiesTest {

    private static final long SEED = 20261201L;
    private static final double ROUND_TRIP = 1e-12;

    /** Photon energies log-uniform from 1e-6 eV (radio) to 1e5 eV (X-ray), in eV. */
    private static Gen<Double> photonEnergiesEv() {
        return doubles().between(-6, 5).map(exponent -> Math.pow(10, exponent));
    }

    private static Gen<Medium> media() {
        return arbitrary().pick(List.of(Medium.vacuum(), Medium.air(),
                Medium.air(new Ciddor1996(20, 101_325, 40, 450)), Medium.air(new Ciddor1996(-10, 70_000, 90, 800))));
    }

    @Test
    void everyKindRoundTripsThroughEveryOther() {
        qt().withFixedSeed(SEED).forAll(photonEnergiesEv()).checkAssert(ev -> {
            Energy energy = Energy.ofElectronVolts(ev);
            for (SpectralQuantity via : List.of(energy.toFrequency(), energy.toWavenumber(),
                    energy.toWavelength(Medium.vacuum()))) {
                assertTrue(via.toEnergy().isCloseTo(energy, ROUND_TRIP), () -> energy + " via " + via);
                assertTrue(via.toFrequency().isCloseTo(energy.toFrequency(), ROUND_TRIP));
                assertTrue(via.toWavenumber().isCloseTo(energy.toWavenumber(), ROUND_TRIP));
                assertTrue(via.toWavelength(Medium.vacuum()).isCloseTo(energy.toWavelength(Medium.vacuum()),
                        ROUND_TRIP));
            }
            assertTrue(energy.toTemperature().toThermalEnergy().isCloseTo(energy, ROUND_TRIP));
        });
    }

    @Test
    void airWavelengthsRoundTripThroughVacuumAndFrequency() {
        qt().withFixedSeed(SEED).forAll(doubles().between(300, 1689), media()).checkAssert((nm, medium) -> {
            Wavelength wavelength = Wavelength.ofNanometres(nm, medium);
            Wavelength vacuum = wavelength.toWavelength(Medium.vacuum());
            assertTrue(vacuum.toWavelength(medium).isCloseTo(wavelength, ROUND_TRIP), () -> wavelength.toString());
            assertTrue(wavelength.toFrequency().toWavelength(medium).isCloseTo(wavelength, ROUND_TRIP));
            assertTrue(wavelength.toEnergy().toWavelength(medium).isCloseTo(wavelength, ROUND_TRIP));
            assertTrue(wavelength.toWavenumber().toWavelength(medium).isCloseTo(wavelength, ROUND_TRIP));
        });
    }

    @Test
    void uncertaintyTravelsToFirstOrder() {
        // u_y = |dy/dx| u_x, with dy/dx by a central difference of the conversion itself.
        qt().withFixedSeed(SEED).forAll(doubles().between(300, 1689), media()).checkAssert((nm, medium) -> {
            double u = 1e-3;
            Wavelength wavelength = Wavelength.of(nm, u, Unit.NANOMETRE, medium);
            double h = 1e-4;
            double slope = (Wavelength.ofNanometres(nm + h, medium).toFrequency().inHertz()
                    - Wavelength.ofNanometres(nm - h, medium).toFrequency().inHertz()) / (2 * h);
            double expected = Math.abs(slope) * u;
            double actual = wavelength.toFrequency().uncertaintyIn(Unit.HERTZ).orElseThrow();
            assertEquals(expected, actual, 1e-5 * expected, wavelength::toString);
            Wavelength back = wavelength.toFrequency().toWavelength(medium);
            assertEquals(u, back.uncertaintyIn(Unit.NANOMETRE).orElseThrow(), 1e-9 * u);
        });
    }

    @Test
    void formattedTextParsesBackToTheSameQuantity() {
        QuantityText text = QuantityText.standard();
        Gen<Double> mantissas = doubles().between(1, 10);
        Gen<Integer> exponents = integers().between(-30, 30);
        qt().withFixedSeed(SEED).forAll(mantissas, exponents, arbitrary().enumValues(Unit.class), media())
                .assuming((m, e, unit, medium) -> unit.kind() != Kind.WAVELENGTH || e >= -15 && e <= 15)
                .checkAssert((m, e, unit, medium) -> {
                    double value = m * Math.pow(10, e);
                    Quantity quantity = build(value, unit, medium);
                    String formatted = text.format(quantity, unit);
                    assertEquals(quantity, text.parse(formatted), formatted);
                });
    }

    @Test
    void formattedUncertaintyParsesBackWithinItsRounding() {
        QuantityText text = QuantityText.standard();
        qt().withFixedSeed(SEED).forAll(doubles().between(1, 1e6), doubles().between(1e-9, 1e-2), media())
                .checkAssert((nm, relative, medium) -> {
                    Wavelength wavelength = Wavelength.of(nm, nm * relative, Unit.NANOMETRE, medium);
                    String formatted = text.format(wavelength, Unit.NANOMETRE);
                    Wavelength back = (Wavelength) text.parse(formatted);
                    double u = nm * relative;
                    assertEquals(wavelength.medium(), back.medium());
                    assertEquals(nm, back.inNanometres(), 0.051 * u, formatted);
                    assertEquals(u, back.uncertaintyIn(Unit.NANOMETRE).orElseThrow(), 0.051 * u, formatted);
                });
    }

    private static Quantity build(double value, Unit unit, Medium medium) {
        switch (unit.kind()) {
            case WAVELENGTH:
                return Wavelength.of(value, unit, medium);
            case WAVENUMBER:
                return Wavenumber.of(value, unit);
            case FREQUENCY:
                return Frequency.of(value, unit);
            case ENERGY:
                return Energy.of(value, unit);
            default:
                return Temperature.of(value, unit);
        }
    }
}
