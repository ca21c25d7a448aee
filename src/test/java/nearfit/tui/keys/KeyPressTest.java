package nearfit.tui.keys;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.results.Results;

class KeyPressTest {
    private final ScriptedWorkbench wb = new ScriptedWorkbench();
    private final KeyContext cx = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 3, 0, true, 5);
    private final ViewState two = ViewState.initial("power_kw", List.of("wind_ms", "air_temp_c"), 20);

    private static KeyStroke ch(char c) {
        return new KeyStroke(c, false, false);
    }

    private Step press(ViewState s, char c) {
        return KeyPress.next(s, ch(c), cx);
    }

    @Test
    void ctrlCAsksForAnInterrupt() {
        Step step = KeyPress.next(two, new KeyStroke('c', true, false), cx);
        assertInstanceOf(Effect.Interrupt.class, step.effect());
    }

    @Test
    void theHeldOutKeyCyclesOnlyThroughTheSchemesThatApply() {
        KeyContext noTime = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 3, 0, false, 5);
        // A time column and a group: leave-one-out, days, group, and round again.
        ViewState s = two.edit().groupColumn("turbine").build();
        List<HeldOutChoice> seen = new java.util.ArrayList<>();
        for (int i = 0; i < 4; i++) {
            Step step = press(s, 'H');
            s = step.state();
            seen.add(s.heldOut());
            assertEquals(s.heldOut().words(), s.message());
            assertFalse(s.warning());
        }
        assertEquals(List.of(HeldOutChoice.DAYS, HeldOutChoice.GROUP, HeldOutChoice.LEAVE_ONE_OUT,
                HeldOutChoice.DAYS), seen);
        // A time column, no group: days and leave-one-out only.
        ViewState t = press(two, 'H').state();
        assertEquals(HeldOutChoice.DAYS, t.heldOut());
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, press(t, 'H').state().heldOut());
        // A group, no time column: group and leave-one-out only.
        ViewState g = KeyPress.next(two.edit().groupColumn("turbine").build(), ch('H'), noTime).state();
        assertEquals(HeldOutChoice.GROUP, g.heldOut());
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, KeyPress.next(g, ch('H'), noTime).state().heldOut());
        // Neither: a warning, and the choice stays leave-one-out.
        ViewState none = KeyPress.next(two, ch('H'), noTime).state();
        assertTrue(none.warning(), none.message());
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, none.heldOut());
        // A group choice whose group column is gone runs, and cycles on, as leave-one-out.
        ViewState gone = g.edit().groupColumn(null).build();
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, gone.tuningChoice(true));
        assertEquals(HeldOutChoice.DAYS, press(gone, 'H').state().heldOut());
    }

    @Test
    void holdingOutByGroupIsNotOfferedForAGroupColumnOfOneGroupAndTheMessageSaysWhy() {
        KeyContext oneGroup = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 1, 0, true, 5);
        KeyContext oneGroupNoTime = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 1, 0, false, 5);
        ViewState s = two.edit().groupColumn("turbine").build();
        // A time column: days, then back to leave-one-out, never group.
        ViewState days = KeyPress.next(s, ch('H'), oneGroup).state();
        assertEquals(HeldOutChoice.DAYS, days.heldOut());
        assertEquals("k by days held out (by group needs two groups; turbine has one)", days.message());
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, KeyPress.next(days, ch('H'), oneGroup).state().heldOut());
        // No time column: nothing else applies, and the warning says why group does not.
        ViewState none = KeyPress.next(s, ch('H'), oneGroupNoTime).state();
        assertTrue(none.warning());
        assertEquals("only leave-one-out applies: by group needs two groups; turbine has one", none.message());
        assertEquals(HeldOutChoice.LEAVE_ONE_OUT, none.heldOut());
    }

    @Test
    void zoomInKeepsTheCrosshairValueInPlace() {
        ViewState s = two.edit().crosshair(0.2).build();
        ViewState z = press(s, ']').state();
        double before = 0 + 0.2 * 25;
        double after = z.zoomFrom() + z.crosshair() * (z.zoomTo() - z.zoomFrom());
        assertEquals(before, after, 1e-12);
        assertEquals(12.5, z.zoomTo() - z.zoomFrom(), 1e-12);
        ViewState back = press(z, '[').state();
        assertTrue(back.wholeRange(), "zooming out to the whole span shows the whole data");
        assertEquals(0.2, back.crosshair(), 1e-12);
    }

    @Test
    void heldValueStepsBy5PercentAndStopsAtTheEnds() {
        ViewState s = two;
        for (int i = 0; i < 3; i++) {
            s = press(s, '>').state();
        }
        assertEquals(0.65, s.heldQuantile().get("air_temp_c"), 1e-12);
        for (int i = 0; i < 30; i++) {
            s = press(s, '<').state();
        }
        assertEquals(0.0, s.heldQuantile().get("air_temp_c"), 1e-12);
    }

    @Test
    void removingTheDisplayInputMovesTheDisplayToAnotherInput() {
        ViewState s = press(two, 'i').state();
        assertEquals(Overlay.PICKER, s.overlay());
        // Options for inputs: time, wind_ms, air_temp_c (numeric, not the response); wind_ms is line 1.
        s = KeyPress.next(s, new KeyStroke(KeyType.ArrowDown), cx).state();
        s = KeyPress.next(s, ch(' '), cx).state();
        assertEquals(List.of("air_temp_c"), s.inputs());
        assertEquals("air_temp_c", s.displayInput());
        assertTrue(s.heldQuantile().isEmpty(), "nothing is held with one input");
        s = KeyPress.next(s, ch(' '), cx).state();
        assertEquals(List.of("air_temp_c", "wind_ms"), s.inputs());
        assertEquals(0.5, s.heldQuantile().get("wind_ms"), 0, "a new input is held at its median");
    }

    @Test
    void enterClosesTheInputsPickerKeepingWhatSpaceAdded() {
        ViewState s = press(ViewState.initial("power_kw", List.of("wind_ms"), 20), 'i').state();
        // Options: time, wind_ms, air_temp_c; air_temp_c is line 2.
        s = KeyPress.next(s, new KeyStroke(KeyType.ArrowDown), cx).state();
        s = KeyPress.next(s, new KeyStroke(KeyType.ArrowDown), cx).state();
        s = KeyPress.next(s, ch(' '), cx).state();
        assertEquals(List.of("wind_ms", "air_temp_c"), s.inputs());
        s = KeyPress.next(s, new KeyStroke(KeyType.Enter), cx).state();
        assertEquals(List.of("wind_ms", "air_temp_c"), s.inputs(), "Enter keeps the inputs chosen");
        assertEquals(Overlay.NONE, s.overlay(), "Enter closes the picker");
    }

    @Test
    void theLastInputCannotBeRemoved() {
        assertEquals(List.of("a"), KeyPress.toggle(List.of("a"), "a"));
    }

    @Test
    void nextGroupWrapsAroundAndAllGroupsClearsCompare() {
        ViewState s = two.edit().groupColumn("turbine").build();
        s = press(press(press(s, 'n').state(), 'n').state(), 'n').state();
        assertEquals(2, s.group());
        s = press(s, 'n').state();
        assertEquals(0, s.group());
        s = press(s, 'o').state();
        assertTrue(s.compare());
        s = press(s, 'a').state();
        assertEquals(-1, s.group());
        assertFalse(s.compare());
    }

    @Test
    void exportAsksForAFileAndAnExistingFileNeedsAYes() {
        ViewState s = press(two, 'e').state();
        s = press(s, '3').state();
        assertEquals(Ask.FILE, s.ask());
        assertEquals("nearfit-plot.png", s.typed());
        Step enter = KeyPress.next(s, new KeyStroke(KeyType.Enter), cx);
        assertEquals(new Effect.Export(ExportKind.PNG, "nearfit-plot.png", false), enter.effect());
        ViewState confirm = enter.state().edit().overlay(Overlay.CONFIRM).build();
        assertEquals(new Effect.Export(ExportKind.PNG, "nearfit-plot.png", true), press(confirm, 'y').effect());
        assertEquals(Effect.NONE, press(confirm, 'n').effect());
    }

    @Test
    void everyKeyOfTheMapDoesSomethingOnThePlot() {
        // Each character key of the help list changes the state or says why it cannot.
        ViewState s = two.edit().groupColumn("turbine").group(0).build();
        for (KeyTable k : KeyTable.values()) {
            if (k.key().length() == 1 && !k.key().equals("q")) {
                Step step = press(s, k.key().charAt(0));
                assertFalse(step.state().equals(s) && step.effect().equals(Effect.NONE), "key " + k.key());
            }
        }
    }

    @Test
    void enterInTheFlaggedTableKeepsAZoomThatHoldsTheRowAndMovesOneThatDoesNot() {
        ScriptedWorkbench wb = new ScriptedWorkbench();
        FlaggedRows flags = wb.flags(null, null, "", JobControl.NONE);
        KeyContext withFlags = new KeyContext(wb.columns(), Results.none(1000).withFlags(flags, Double.NaN), 0, 25, 3,
                0, true, 5);
        ViewState table = two.edit().zoom(10, 15).open(Overlay.FLAGS, Ask.NOTHING).build();
        // Row 41 lies at wind 12.5, inside 10..15: the zoom stays and the crosshair goes to it.
        ViewState in = KeyPress.next(table, new KeyStroke(KeyType.Enter), withFlags).state();
        assertEquals(41, in.markedRow());
        assertEquals(10, in.zoomFrom(), 1e-12);
        assertEquals(15, in.zoomTo(), 1e-12);
        assertEquals(0.5, in.crosshair(), 1e-12);
        // Row 7 lies at wind 5, outside: the view keeps its width of 5 and centres on it.
        ViewState down = KeyPress.next(table, new KeyStroke(KeyType.ArrowDown), withFlags).state();
        ViewState out = KeyPress.next(down, new KeyStroke(KeyType.Enter), withFlags).state();
        assertEquals(7, out.markedRow());
        assertEquals(2.5, out.zoomFrom(), 1e-12);
        assertEquals(7.5, out.zoomTo(), 1e-12);
        assertEquals(0.5, out.crosshair(), 1e-12);
    }

    @Test
    void aPickerTakesEveryLetterAndJumpsByIt() {
        ViewState picker = press(two, 'g').state();
        assertEquals(0, picker.cursor(), "no group column yet: the cursor is on (no group)");
        ViewState t = press(picker, 't').state();
        assertEquals(Overlay.PICKER, t.overlay());
        assertEquals(1, t.cursor(), "t jumps to turbine");
        for (char c : "qmwsbfT+-0]".toCharArray()) {
            Step step = press(t, c);
            assertEquals(Overlay.PICKER, step.state().overlay(), "key " + c);
            assertEquals(t.edit().cursor(step.state().cursor()).build(), step.state(), "key " + c + " only moves");
        }
    }

    @Test
    void rSwitchesWhetherTheConditionNarrowsTheReference() {
        ViewState s = two.edit().condition("wind_ms > 5").build();
        assertEquals("", s.model().condition(), "by default the reference is every row");
        ViewState r = press(s, 'R').state();
        assertEquals("wind_ms > 5", r.model().condition());
        assertEquals("", press(r, 'R').state().model().condition());
    }
}
