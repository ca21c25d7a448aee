package nearfit.tui;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

/** Typing into the prompts for k, a row condition and an export file name. */
final class Prompts {
    /** Longest text a prompt accepts. */
    static final int MAX_TYPED = 200;

    private Prompts() {
    }

    static Step next(ViewState s, KeyStroke key) {
        switch (key.getKeyType()) {
            case Escape:
                return Step.of(s.edit().close().build());
            case Backspace:
                return Step.of(s.edit().typed(s.typed().isEmpty() ? "" : s.typed().substring(0, s.typed().length() - 1))
                        .build());
            case Enter:
                return submit(s);
            case Character:
                if (s.typed().length() >= MAX_TYPED || key.isCtrlDown() || key.isAltDown()) {
                    return Step.of(s);
                }
                return Step.of(s.edit().typed(s.typed() + key.getCharacter()).build());
            default:
                return Step.of(s);
        }
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
                return Step.of(s.edit().close().message("k must be a whole number of at least 1, not \"" + text
                        + "\"").build());
            case CONDITION:
                return new Step(s.edit().close().build(), new Effect.ApplyCondition(text));
            case FILE:
                if (text.isEmpty() || s.export() == null) {
                    return Step.of(s.edit().close().message("no file name: nothing written").build());
                }
                return new Step(s.edit().overlay(Overlay.NONE).ask(Ask.NOTHING).typed(text).build(),
                        new Effect.Export(s.export(), text, false));
            default:
                return Step.of(s.edit().close().build());
        }
    }
}
