package nearfit.tui.keys;

import java.util.ArrayList;
import java.util.List;

import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;

/** The lines a column picker offers, for each thing it can ask. */
public final class Pickers {
    /** The line that stands for "no group column". */
    public static final String NO_GROUP = "(no group)";

    private Pickers() {
    }

    /** The current choice of what a picker asks for, or {@code null} when it has none (the inputs). */
    public static String current(ViewState s) {
        return switch (s.ask()) {
            case DISPLAY_INPUT -> s.displayInput();
            case RESPONSE -> s.response();
            case GROUP -> s.groupColumn() == null ? NO_GROUP : s.groupColumn();
            case HELD_INPUT -> s.heldInput();
            default -> null;
        };
    }

    /**
     * The first option after {@code from} (wrapping around) whose name starts with {@code c}, ignoring case;
     * -1 when none does.
     */
    public static int nextStartingWith(List<String> options, int from, char c) {
        int n = options.size();
        char want = Character.toLowerCase(c);
        for (int i = 1; i <= n; i++) {
            int at = Math.floorMod(from + i, n);
            String o = options.get(at);
            if (!o.isEmpty() && Character.toLowerCase(o.charAt(0)) == want) {
                return at;
            }
        }
        return -1;
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
