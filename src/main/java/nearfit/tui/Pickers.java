package nearfit.tui;

import java.util.ArrayList;
import java.util.List;

/** The lines a column picker offers, for each thing it can ask. */
public final class Pickers {
    /** The line that stands for "no group column". */
    public static final String NO_GROUP = "(no group)";

    private Pickers() {
    }

    /** The choices for {@code ask} in state {@code s}. */
    public static List<String> options(Ask ask, ViewState s, List<ColumnInfo> columns) {
        List<String> out = new ArrayList<>();
        switch (ask) {
            case DISPLAY_INPUT, INPUTS -> {
                for (ColumnInfo c : columns) {
                    if (c.kind().numeric() && !c.name().equals(s.response())) {
                        out.add(c.name());
                    }
                }
            }
            case RESPONSE -> {
                for (ColumnInfo c : columns) {
                    if ((c.kind() == ColumnKind.NUMBER || c.kind() == ColumnKind.CATEGORY)
                            && !s.inputs().contains(c.name())) {
                        out.add(c.name());
                    }
                }
            }
            case GROUP -> {
                out.add(NO_GROUP);
                for (ColumnInfo c : columns) {
                    if (c.kind() == ColumnKind.CATEGORY && !c.name().equals(s.response())) {
                        out.add(c.name());
                    }
                }
            }
            case HELD_INPUT -> {
                for (String in : s.inputs()) {
                    if (!in.equals(s.displayInput())) {
                        out.add(in);
                    }
                }
            }
            default -> {
            }
        }
        return out;
    }
}
