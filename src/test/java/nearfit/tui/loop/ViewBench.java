package nearfit.tui.loop;

import java.io.InputStream;
import java.io.OutputStream;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.ansi.ANSITerminal;

import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.PlotScene;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Look;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;

/**
 * The explorer's speed, run by scripts/bench-view (not a test): on an ANSI terminal of 120x40 whose output is
 * counted, the time from a k key press to the finished frame (the new curve in and drawn), the bytes written
 * for it, the start to the first frame and, optionally, leave-one-out flags in the background. The reference
 * side makes the same core calls directly (the curve for the new k, then the composed plot), with no
 * explorer and no terminal, so the ratio is the explorer's own cost.
 *
 * <p>Arguments: FILE RESPONSE INPUTS REPEATS [flags]. Prints "name value" lines.
 */
public final class ViewBench {
    /** Presses before timing: the first dozen run before the JIT has compiled the frame path (about 3x slower). */
    private static final int WARMUP = 10;

    private ViewBench() {
    }

    /** An ANSI terminal of fixed size whose output is counted and dropped; it never sends keys. */
    static final class CountingTerminal extends ANSITerminal {
        private final TerminalSize size;

        CountingTerminal(Counter counter, TerminalSize size) {
            super(InputStream.nullInputStream(), counter, StandardCharsets.UTF_8);
            this.size = size;
        }

        @Override
        protected TerminalSize findTerminalSize() {
            return size;
        }
    }

    /** Counts bytes. */
    static final class Counter extends OutputStream {
        volatile long bytes;

        @Override
        public void write(int b) {
            bytes++;
        }

        @Override
        public void write(byte[] b, int off, int len) {
            bytes += len;
        }
    }

    public static void main(String[] args) throws Exception {
        Path file = Path.of(args[0]);
        List<String> inputs = Arrays.asList(args[2].split(","));
        int repeats = Integer.parseInt(args[3]);
        boolean flags = args.length > 4 && args[4].equals("flags");
        Workbench wb = CoreWorkbench.of(CsvLoader.load(file, file.toString(), LoadOptions.DEFAULT), file.toString());
        Counter counter = new Counter();
        TerminalScreen screen = new TerminalScreen(new CountingTerminal(counter, new TerminalSize(120, 40)));
        screen.startScreen();
        ViewState first = ViewState.initial(args[1], inputs, 20);
        try (Explorer ex = new Explorer(screen, wb, first, new Look(false, true))) {
            ex.start();
            double startToFrame = (System.currentTimeMillis() - ManagementFactory.getRuntimeMXBean().getStartTime()) / 1e3;
            ex.settleCurve();
            double startToCurve = (System.currentTimeMillis() - ManagementFactory.getRuntimeMXBean().getStartTime()) / 1e3;
            print("start_to_first_frame_s", startToFrame);
            print("start_to_first_curve_s", startToCurve);
            if (flags) {
                long f0 = System.nanoTime();
                ex.settle("flags");
                print("flags_in_background_s", (System.nanoTime() - f0) / 1e9);
            }
            List<Double> ms = new ArrayList<>();
            List<Double> bytes = new ArrayList<>();
            List<Double> ref = new ArrayList<>();
            for (int i = 0; i < repeats + WARMUP; i++) {
                char key = i % 2 == 0 ? '+' : '-';
                long b0 = counter.bytes;
                long s = System.nanoTime();
                ex.press(new KeyStroke(key, false, false));
                ex.settleCurve();
                double took = (System.nanoTime() - s) / 1e6;
                long written = counter.bytes - b0;
                double direct = direct(wb, ex);
                if (i >= WARMUP) {
                    ms.add(took);
                    bytes.add((double) written);
                    ref.add(direct);
                }
            }
            print("k_change_ms_median", median(ms));
            print("k_change_reference_ms_median", median(ref));
            print("k_change_bytes_median", median(bytes));
            print("k_change_bytes_max", max(bytes));
            System.out.println("k_change_ms_all " + ms);
        }
        screen.stopScreen();
        System.exit(0);
    }

    /** The same curve and plot as the explorer's last frame, by direct core calls. */
    private static double direct(Workbench wb, Explorer ex) {
        ViewState s = ex.state();
        CurveRequest q = ex.request();
        long t = System.nanoTime();
        CurveResult c = wb.curve(s.model(), q, JobControl.NONE);
        PlotScene scene = new PlotScene(s.model(), q, c, ex.results().flags(), s.mode(), s.flagMarks(),
                q.from() + s.crosshair() * (q.to() - q.from()), s.heldQuantile(), s.nearHeldOnly(), -1, false, s.condition());
        wb.plot(scene, 120, 35);
        return (System.nanoTime() - t) / 1e6;
    }

    private static void print(String name, double v) {
        System.out.println(name + " " + String.format(Locale.ROOT, "%.3f", v));
    }

    static double median(List<Double> v) {
        double[] a = new double[v.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = v.get(i);
        }
        Arrays.sort(a);
        int n = a.length;
        return n == 0 ? Double.NaN : n % 2 == 1 ? a[n / 2] : (a[n / 2 - 1] + a[n / 2]) / 2;
    }

    private static double max(List<Double> v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double d : v) {
            m = Math.max(m, d);
        }
        return m;
    }
}
