/**
 * Root package: the project's base exception. Everything here is immutable and thread-safe.
 */
package org.ritzwerk;
