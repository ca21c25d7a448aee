package nearfit.tui.keys;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

/** Typing into the prompts for k, a row condition and an export file name. */
public final class Prompts {
    /** Longest text a prompt accepts. */
    static final int MAX_TYPED = 200;

    private Prompts() {
    }

    /**
     * Editing keys: Left and Right move the caret, Home and End jump to the ends, Backspace and Delete remove
     * the character before or after it, Ctrl-U removes everything before it; Enter submits, Esc cancels.
     */
    static Step next(ViewState s, KeyStroke key) {
        String t = s.typed();
        int caret = Math.max(0, t.length() - Math.min(t.length(), s.caretBack()));
        switch (key.getKeyType()) {
            case Escape:
                return Step.of(s.edit().close().build());
            case Backspace:
                return caret == 0 ? Step.of(s) : Step.of(s.edit().typed(t.substring(0, caret - 1) + t.substring(caret))
                        .build());
            case Delete:
                return caret == t.length() ? Step.of(s)
                        : Step.of(s.edit().typed(t.substring(0, caret) + t.substring(caret + 1))
                                .caretBack(t.length() - caret - 1).build());
            case ArrowLeft:
                return Step.of(s.edit().caretBack(t.length() - Math.max(0, caret - 1)).build());
            case ArrowRight:
                return Step.of(s.edit().caretBack(t.length() - Math.min(t.length(), caret + 1)).build());
            case Home:
                return Step.of(s.edit().caretBack(t.length()).build());
            case End:
                return Step.of(s.edit().caretBack(0).build());
            case Enter:
                return submit(s);
            case Character:
                if (key.isCtrlDown() && Character.toLowerCase(key.getCharacter()) == 'u') {
                    return Step.of(s.edit().typed(t.substring(caret)).caretBack(t.length() - caret).build());
                }
                if (t.length() >= MAX_TYPED || key.isCtrlDown() || key.isAltDown()) {
                    return Step.of(s);
                }
                return Step.of(s.edit().typed(t.substring(0, caret) + key.getCharacter() + t.substring(caret)).build());
            default:
                return Step.of(s);
        }
    }

    /** Where the caret is in the typed text, from 0 (before the first character) to its length. */
    public static int caret(ViewState s) {
        return Math.max(0, s.typed().length() - Math.min(s.typed().length(), s.caretBack()));
    }

    private static Step submit(ViewState s) {
        String text = s.typed().strip();
        switch (s.ask()) {
            case K:
                try {
                    int k = Integer.parseInt(text);
                    if (k >= 1) {
                        return Step.of(s.edit().close().k(k).build());
                    }
                } catch (NumberFormatException e) {
                    // Falls through to the message below.
                }
                return Step.of(s.edit().close().warning("k must be a whole number of at least 1, not \"" + text
                        + "\"").build());
            case CONDITION:
                return new Step(s.edit().close().build(), new Effect.ApplyCondition(text));
            case FILE:
                if (text.isEmpty() || s.export() == null) {
                    return Step.of(s.edit().close().warning("no file name: nothing written").build());
                }
                return new Step(s.edit().overlay(Overlay.NONE).ask(Ask.NOTHING).typed(text).build(),
                        new Effect.Export(s.export(), text, false));
            default:
                return Step.of(s.edit().close().build());
        }
    }
}
