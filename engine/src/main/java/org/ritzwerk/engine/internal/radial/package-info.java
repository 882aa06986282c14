/**
 * Radial integrals shared by the level models, not part of the API: closed-form hydrogenic
 * radial matrix elements (lengths in units of a0/Z) and the alkali model potentials (atomic
 * units). Stateless and thread-safe. Not exported from the module; callers use the public level
 * models ({@code HydrogenLikeModel}, {@code AlkaliAtom}) instead.
 */
package org.ritzwerk.engine.internal.radial;
