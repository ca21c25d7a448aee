package nearfit.tui.loop;

import nearfit.tui.bench.PlotScene;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.FitKey;
import nearfit.tui.keys.Overlay;
import nearfit.tui.keys.PlotMode;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Drawings;
import nearfit.tui.paint.ScreenRegions;
import nearfit.tui.results.Cells;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.PlotCells;
import nearfit.tui.results.Results;
import nearfit.tui.results.TuningFigures;

/**
 * Makes the {@link Drawings} of a frame from the plot package, through the {@link Workbench}, before the frame
 * is painted; each drawing is kept until its inputs change so that moving between panels redraws without
 * recomposing the scatter. Used from the explorer's thread only.
 */
final class Sketches {
    /**
     * What the composed plot depends on. k, weights and band reach the plot only through the curve and flags
     * (compared by identity), so a frame drawn right after a k change, still with the old curve, reuses it.
     */
    private record PlotKey(FitKey shape, CurveRequest request, CurveResult curve, FlaggedRows flags, PlotMode mode,
            boolean flagMarks, double crosshairX, java.util.Map<String, Double> heldQuantile, boolean nearHeldOnly,
            int markedRow, boolean ascii, int width, int height) {
    }

    /** What the tuning chart depends on. */
    private record ChartKey(TuningFigures tuning, int k, int width, int height, boolean ascii) {
    }

    private final Workbench workbench;
    private PlotKey plotKey;
    private PlotCells plot;
    private ChartKey chartKey;
    private Cells chart;

    Sketches(Workbench workbench) {
        this.workbench = workbench;
    }

    /** The drawings of a frame of this state and these results at this screen size. */
    Drawings of(ScreenRegions layout, ViewState s, Results r, FrameInput in, boolean ascii) {
        if (!layout.fits() || in.request() == null) {
            return new Drawings(null, null);
        }
        PlotCells p = plot(PlotScene.of(s, r, in, ascii), layout.width(), layout.plotHeight());
        Cells c = s.overlay() == Overlay.TUNING && r.tuning() != null
                ? chart(r.tuning(), s.k(), layout.tuningChartWidth(), layout.tuningChartHeight(), ascii) : null;
        return new Drawings(p, c);
    }

    PlotCells plot(PlotScene scene, int width, int height) {
        FitKey m = scene.model();
        FitKey shape = new FitKey(m.condition(), m.response(), m.inputs(), m.settings().withK(1)
                .withWeighting(nearfit.knn.Weighting.UNIFORM).withBand(nearfit.knn.Band.NONE)
                .withEstimate(nearfit.knn.EstimateKind.MEAN));
        PlotKey key = new PlotKey(shape, scene.request(), scene.curve(), scene.flags(), scene.mode(),
                scene.flagMarks(), scene.crosshairX(), scene.heldQuantile(), scene.nearHeldOnly(), scene.markedRow(),
                scene.ascii(), width, height);
        if (!key.equals(plotKey)) {
            plot = workbench.plot(scene, width, height);
            plotKey = key;
        }
        return plot;
    }

    Cells chart(TuningFigures tuning, int k, int width, int height, boolean ascii) {
        ChartKey key = new ChartKey(tuning, k, width, height, ascii);
        if (!key.equals(chartKey)) {
            chart = workbench.tuningChart(tuning, k, width, height, ascii);
            chartKey = key;
        }
        return chart;
    }
}
