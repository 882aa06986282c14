/**
 * Angular-momentum algebra shared by the level models: Wigner 3j and 6j symbols. Arguments are
 * given doubled (2j) so that half-integers are exact; results are dimensionless. Stateless and
 * thread-safe. Not exported from the module.
 */
package org.ritzwerk.engine.internal.angular;
