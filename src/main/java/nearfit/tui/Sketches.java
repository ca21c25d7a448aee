package nearfit.tui;

/**
 * The drawings the screen takes from the plot package, each kept until its inputs change so that moving
 * between panels redraws without recomposing the scatter. Used from the drawing thread only.
 */
final class Sketches {
    private final Workbench workbench;
    private Object plotKey;
    private PlotCells plot;
    private Object chartKey;
    private Cells chart;

    Sketches(Workbench workbench) {
        this.workbench = workbench;
    }

    PlotCells plot(PlotScene scene, int width, int height) {
        // k, weights and band reach the plot only through the curve and flags (compared by identity), so a
        // frame drawn right after a k change, still with the old curve, reuses the composed plot.
        FitKey m = scene.model();
        FitKey shape = new FitKey(m.condition(), m.response(), m.inputs(), m.settings().withK(1)
                .withWeighting(nearfit.knn.Weighting.UNIFORM).withBand(nearfit.knn.Band.NONE)
                .withEstimate(nearfit.knn.EstimateKind.MEAN));
        Object key = java.util.Arrays.asList(shape, scene.request(), scene.curve(), scene.flags(), scene.mode(),
                scene.flagMarks(), scene.crosshairX(), scene.heldQuantile(), scene.nearHeldOnly(), scene.markedRow(),
                scene.ascii(), width, height);
        if (!key.equals(plotKey)) {
            plot = workbench.plot(scene, width, height);
            plotKey = key;
        }
        return plot;
    }

    Cells chart(nearfit.knn.TuningTable tuning, int k, int width, int height, boolean ascii) {
        Object key = java.util.Arrays.asList(tuning, k, width, height, ascii);
        if (!key.equals(chartKey)) {
            chart = workbench.tuningChart(tuning, k, width, height, ascii);
            chartKey = key;
        }
        return chart;
    }
}
