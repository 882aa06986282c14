/**
 * Ritzwerk's typed physical quantities, the edition of the physical constants, and the optical
 * media (vacuum, air under a named refractive-index model) in which wavelengths are stated.
 *
 * <p>This module has no runtime dependencies.
 */
module org.ritzwerk.api {
    exports org.ritzwerk;
    exports org.ritzwerk.atom;
    exports org.ritzwerk.constants;
    exports org.ritzwerk.data;
    exports org.ritzwerk.medium;
    exports org.ritzwerk.quantity;
}
