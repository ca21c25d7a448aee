package nearfit.table;

/** Reads the tokens of a row condition, failing with the 1-based position of what is wrong. */
final class ConditionLexer {
    private final String s;
    private int p;

    ConditionLexer(String s) {
        this.s = s;
    }

    int position() {
        skipSpace();
        return p;
    }

    /** A bare name or one in double quotes. */
    String name(String what) {
        skipSpace();
        if (p < s.length() && s.charAt(p) == '"') {
            return quoted('"');
        }
        int start = p;
        while (p < s.length() && !Character.isWhitespace(s.charAt(p)) && "=!<>'\"".indexOf(s.charAt(p)) < 0) {
            p++;
        }
        if (p == start) {
            throw error("expected " + what);
        }
        return s.substring(start, p);
    }

    RowCondition.Op op() {
        skipSpace();
        for (RowCondition.Op op : new RowCondition.Op[] {RowCondition.Op.NE, RowCondition.Op.LE,
            RowCondition.Op.GE, RowCondition.Op.EQ, RowCondition.Op.LT, RowCondition.Op.GT}) {
            if (s.startsWith(op.symbol(), p)) {
                p += op.symbol().length();
                return op;
            }
        }
        throw error("expected one of = != < <= > >=");
    }

    /** A value: quoted with ' or ", or bare up to the next space. */
    String value() {
        skipSpace();
        if (p < s.length() && (s.charAt(p) == '\'' || s.charAt(p) == '"')) {
            return quoted(s.charAt(p));
        }
        int start = p;
        while (p < s.length() && !Character.isWhitespace(s.charAt(p))) {
            p++;
        }
        if (p == start) {
            throw error("expected a value");
        }
        return s.substring(start, p);
    }

    /** Consumes {@code and} and answers true, or answers false at the end; anything else is an error. */
    boolean and() {
        skipSpace();
        if (p == s.length()) {
            return false;
        }
        if (s.regionMatches(true, p, "and", 0, 3) && (p + 3 == s.length() || Character.isWhitespace(s.charAt(p + 3)))) {
            p += 3;
            return true;
        }
        throw error("expected 'and' or the end of the condition");
    }

    private String quoted(char q) {
        int open = p;
        int close = s.indexOf(q, p + 1);
        if (close < 0) {
            p = open;
            throw error("the quote is never closed");
        }
        p = close + 1;
        return s.substring(open + 1, close);
    }

    private void skipSpace() {
        while (p < s.length() && Character.isWhitespace(s.charAt(p))) {
            p++;
        }
    }

    private NearfitException error(String detail) {
        return new NearfitException("row condition, position " + (p + 1) + ": " + detail + " in \"" + s + "\"");
    }
}
