/**
 * Readers of user data files and the problem reports they produce. Readers are stateless and
 * thread-safe; results are immutable. {@link org.ritzwerk.refdata.RitzwerkJackson} is the Jackson 3
 * module that writes and reads the value types (quantities, species, states, media) as JSON.
 */
package org.ritzwerk.refdata;
