package dev.assay.cli;

import java.io.PrintWriter;

/** A progress bar with rate on a terminal, rewritten in place; silent when output is not a terminal. */
final class Progress {

    private final PrintWriter out;
    private final boolean enabled;
    private final int total;
    private final String unit;
    private final long start = System.nanoTime();
    private long lastDraw;

    Progress(PrintWriter out, int total, String unit) {
        this.out = out;
        this.total = total;
        this.unit = unit;
        this.enabled = System.console() != null && System.getenv("ASSAY_NO_PROGRESS") == null;
    }

    synchronized void update(int done) {
        if (!enabled) return;
        long now = System.nanoTime();
        if ((total <= 0 || done < total) && now - lastDraw < 100_000_000L) return;
        lastDraw = now;
        double seconds = Math.max(1e-9, (now - start) / 1e9);
        if (total <= 0) { // size unknown: a count and a rate
            out.print("\r" + done + " " + unit + String.format(java.util.Locale.ROOT, ", %.0f/s", done / seconds));
            out.flush();
            return;
        }
        int width = 30;
        int filled = total == 0 ? width : (int) ((long) done * width / total);
        out.print("\r[" + "#".repeat(filled) + " ".repeat(width - filled) + "] " + done + "/" + total + " " + unit
                + String.format(java.util.Locale.ROOT, ", %.1f/s", done / seconds));
        out.flush();
    }

    synchronized void finish() {
        if (!enabled) return;
        out.print("\r" + " ".repeat(72) + "\r");
        out.flush();
    }
}
