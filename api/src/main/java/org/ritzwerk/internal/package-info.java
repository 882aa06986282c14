/**
 * Implementation details shared inside the api module; not exported, not API.
 */
package org.ritzwerk.internal;
