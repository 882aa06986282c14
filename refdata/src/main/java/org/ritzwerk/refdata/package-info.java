/**
 * Readers of user data files and the problem reports they produce. Readers are stateless and
 * thread-safe; results are immutable.
 */
package org.ritzwerk.refdata;
