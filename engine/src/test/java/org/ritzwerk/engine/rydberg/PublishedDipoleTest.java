package org.ritzwerk.engine.rydberg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;

/** {@link AlkaliAtom#withPublishedDipoles} and {@link AlkaliAtom#reducedDipoleFromLifetime}. */
class PublishedDipoleTest {

    private static final State S5 = State.of(5, 0, 1);
    private static final State P1 = State.of(5, 1, 1);
    private static final State P3 = State.of(5, 1, 3);

    @Test
    void theElementOfExactlyThatPairIsReplacedInEitherOrder() {
        AlkaliAtom bare = TestAtoms.rubidium();
        AlkaliAtom atom = bare.withPublishedDipoles(List.of(new PublishedDipole(S5, P3, 5.9, 0.01, "test value")));
        assertEquals(5.9, Math.abs(atom.reducedDipole(S5, P3)), 1e-12);
        assertEquals(5.9, Math.abs(atom.reducedDipole(P3, S5)), 1e-12);
        // the sign follows the computed element
        assertEquals(Math.signum(bare.reducedDipole(S5, P3)), Math.signum(atom.reducedDipole(S5, P3)));
        // other pairs are untouched, bit for bit
        assertEquals(bare.reducedDipole(S5, P1), atom.reducedDipole(S5, P1));
        State r = State.of(30, 1, 3);
        assertEquals(bare.reducedDipole(S5, r), atom.reducedDipole(S5, r));
        // the rate follows the element: A = omega^3 |d|^2 / (3 pi eps0 hbar c^3 (2j + 1))
        double scale = 5.9 / Math.abs(bare.reducedDipole(S5, P3));
        assertEquals(bare.einsteinA(P3, S5) * scale * scale, atom.einsteinA(P3, S5), 1e-12 * atom.einsteinA(P3, S5));
        assertTrue(atom.publishedDipole(P3, S5).isPresent());
        assertTrue(atom.publishedDipole(S5, P1).isEmpty());
        assertEquals(1, atom.publishedDipoles().size());
        assertTrue(atom.toString().contains("1 published dipole elements"));
    }

    @Test
    void theLifetimeConversionInvertsTheRate() {
        AlkaliAtom atom = TestAtoms.rubidium();
        double nu = atom.frequencyHz(S5, P3);
        double tau = 26.2e-9;
        double d = AlkaliAtom.reducedDipoleFromLifetime(nu, tau, 3);
        AlkaliAtom given = atom.withPublishedDipoles(List.of(new PublishedDipole(S5, P3, d, 0, "from tau")));
        assertEquals(1 / tau, given.einsteinA(P3, S5), 1e-12 / tau);
        // doubling the lifetime divides the element by sqrt 2
        assertEquals(d / Math.sqrt(2), AlkaliAtom.reducedDipoleFromLifetime(nu, 2 * tau, 3), 1e-12 * d);
        assertThrows(IllegalArgumentException.class, () -> AlkaliAtom.reducedDipoleFromLifetime(nu, 0, 3));
        assertThrows(IllegalArgumentException.class, () -> AlkaliAtom.reducedDipoleFromLifetime(Double.NaN, tau, 3));
        assertThrows(IllegalArgumentException.class, () -> AlkaliAtom.reducedDipoleFromLifetime(nu, tau, 0));
    }

    @Test
    void badElementsAreRefused() {
        AlkaliAtom atom = TestAtoms.rubidium();
        PublishedDipole one = new PublishedDipole(S5, P3, 5.9, 0, "a");
        PublishedDipole again = new PublishedDipole(P3, S5, 6.0, 0, "b");
        IllegalArgumentException twice = assertThrows(IllegalArgumentException.class,
                () -> atom.withPublishedDipoles(List.of(one, again)));
        assertTrue(twice.getMessage().contains("two published dipole elements"), twice.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new PublishedDipole(S5, State.of(5, 2, 5), 1, 0, "x"));
        assertThrows(IllegalArgumentException.class, () -> new PublishedDipole(S5, P3, Double.NaN, 0, "x"));
        assertThrows(IllegalArgumentException.class, () -> new PublishedDipole(S5, P3, 1, -1, "x"));
        assertThrows(IllegalArgumentException.class, () -> new PublishedDipole(P1, State.of(4, 2, 5), 1, 0, "x"));
    }
}
