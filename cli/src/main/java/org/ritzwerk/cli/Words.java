package org.ritzwerk.cli;

/** Wording the commands' reports share. Stateless. */
final class Words {

    private Words() {
    }

    /**
     * A count with its noun, singular for one.
     *
     * @param n    the count
     * @param noun the singular, made plural with an s (e.g. "line", "strong line")
     * @return "1 peak", "0 peaks", "2 strong lines"
     */
    static String count(long n, String noun) {
        return n + " " + noun + (n == 1 ? "" : "s");
    }
}
