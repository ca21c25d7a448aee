package nearfit.tui.keys;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** What choosing a column in a picker does to the state. */
final class ColumnChoice {
    private ColumnChoice() {
    }

    static ViewState apply(ViewState s, Ask ask, String column, KeyContext cx) {
        ViewState.Builder b = s.edit().close();
        switch (ask) {
            case DISPLAY_INPUT -> {
                List<String> inputs = new ArrayList<>(s.inputs());
                if (!inputs.contains(column)) {
                    inputs.set(inputs.indexOf(s.displayInput()), column);
                }
                return withInputs(b, s, inputs, column).zoom(Double.NaN, Double.NaN).build();
            }
            case INPUTS -> {
                List<String> inputs = KeyPress.toggle(s.inputs(), column);
                String display = inputs.contains(s.displayInput()) ? s.displayInput() : inputs.get(0);
                // Stay in the picker so several inputs can be toggled in a row.
                return withInputs(b, s, inputs, display).overlay(Overlay.PICKER).ask(Ask.INPUTS)
                        .cursor(s.cursor()).build();
            }
            case RESPONSE -> {
                return b.response(column).responseClass(0).mode(PlotMode.RESPONSE).build();
            }
            case GROUP -> {
                String g = Pickers.NO_GROUP.equals(column) ? null : column;
                return b.groupColumn(g).group(-1).compare(false).build();
            }
            case HELD_INPUT -> {
                return b.heldInput(column).message("< and > move the held value of " + column).build();
            }
            default -> {
                return s;
            }
        }
    }

    /** Sets the inputs and the display input, keeping held quantiles of inputs that stay held. */
    private static ViewState.Builder withInputs(ViewState.Builder b, ViewState s, List<String> inputs,
            String display) {
        Map<String, Double> held = new HashMap<>();
        String heldInput = null;
        for (String in : inputs) {
            if (!in.equals(display)) {
                held.put(in, s.heldQuantile().getOrDefault(in, 0.5));
                if (heldInput == null || in.equals(s.heldInput())) {
                    heldInput = in;
                }
            }
        }
        return b.inputs(inputs).displayInput(display).heldQuantile(held).heldInput(heldInput).nearHeldOnly(
                s.nearHeldOnly() && heldInput != null);
    }
}
