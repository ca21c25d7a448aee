package nearfit.table;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * A row condition: clauses {@code column op value} joined by {@code and}, for example
 * {@code turbine = T03 and wind_ms >= 4 and time < 2025-03-01}.
 *
 * <p>Operators: {@code = != < <= > >=}. Values are numbers for number columns, ISO 8601 dates or
 * date-times for time columns (quote one that has a space), and labels for category columns (only
 * {@code =} and {@code !=}; bare or in single or double quotes). A column name with spaces or operator
 * characters goes in double quotes. A missing value meets no clause, not even {@code !=}. Errors name
 * the column, or the 1-based character position in the condition.
 */
public final class RowCondition {
    /** The comparison of one clause. */
    public enum Op {
        EQ("="), NE("!="), LT("<"), LE("<="), GT(">"), GE(">=");

        private final String symbol;

        Op(String symbol) {
            this.symbol = symbol;
        }

        /** The operator as written. */
        public String symbol() {
            return symbol;
        }

        boolean test(int cmp) {
            return switch (this) {
                case EQ -> cmp == 0;
                case NE -> cmp != 0;
                case LT -> cmp < 0;
                case LE -> cmp <= 0;
                case GT -> cmp > 0;
                case GE -> cmp >= 0;
            };
        }
    }

    /** One parsed clause, as written. */
    public record Clause(String column, Op op, String value) {
    }

    private interface Test {
        boolean test(int row);
    }

    private final String text;
    private final List<Clause> clauses;
    private final List<Test> tests;

    private RowCondition(String text, List<Clause> clauses, List<Test> tests) {
        this.text = text;
        this.clauses = List.copyOf(clauses);
        this.tests = tests;
    }

    /** Parses {@code text} against the columns of {@code table}. */
    public static RowCondition parse(String text, Table table) {
        ConditionLexer lex = new ConditionLexer(text);
        List<Clause> clauses = new ArrayList<>();
        List<Test> tests = new ArrayList<>();
        do {
            int at = lex.position();
            String column = lex.name("a column name");
            if (!table.hasColumn(column)) {
                throw NearfitException.inColumn(column, "no such column in the row condition (position "
                        + (at + 1) + "); the columns are " + String.join(", ", table.names()));
            }
            Op op = lex.op();
            String value = lex.value();
            Clause c = new Clause(column, op, value);
            clauses.add(c);
            tests.add(compile(c, table.column(column)));
        } while (lex.and());
        return new RowCondition(text, clauses, tests);
    }

    /**
     * The column names a condition uses, in order of first mention, checking only its syntax, so that
     * a loader can keep just those columns. Fails as {@link #parse} does on a malformed condition.
     */
    public static List<String> columnsNamed(String text) {
        ConditionLexer lex = new ConditionLexer(text);
        List<String> names = new ArrayList<>();
        do {
            String column = lex.name("a column name");
            if (!names.contains(column)) {
                names.add(column);
            }
            lex.op();
            lex.value();
        } while (lex.and());
        return names;
    }

    /**
     * The clauses of a condition as written, checking only its syntax, for a reader that evaluates them
     * elsewhere (a fleet job translates them to its own column expressions). Fails as {@link #parse} does
     * on a malformed condition.
     */
    public static List<Clause> clausesOf(String text) {
        ConditionLexer lex = new ConditionLexer(text);
        List<Clause> clauses = new ArrayList<>();
        do {
            String column = lex.name("a column name");
            Op op = lex.op();
            clauses.add(new Clause(column, op, lex.value()));
        } while (lex.and());
        return clauses;
    }

    /** The clauses in order. */
    public List<Clause> clauses() {
        return clauses;
    }

    /** The condition as written. */
    public String text() {
        return text;
    }

    /** The rows of {@code table} meeting every clause, in increasing order. */
    public RowSet select(Table table) {
        int n = table.rowCount();
        int[] ids = new int[n];
        int count = 0;
        int clauseCount = tests.size();
        for (int row = 0; row < n; row++) {
            boolean ok = true;
            for (int k = 0; k < clauseCount && ok; k++) {
                ok = tests.get(k).test(row);
            }
            if (ok) {
                ids[count++] = row;
            }
        }
        return RowSet.trusted(java.util.Arrays.copyOf(ids, count));
    }

    private static Test compile(Clause c, Column column) {
        Op op = c.op();
        if (column instanceof DecimalColumn num) {
            byte[] b = bytes(c.value().strip());
            double v = b.length == 0 ? Double.NaN : CellText.parseNumber(b, 0, b.length, false, b);
            if (Double.isNaN(v)) {
                throw NearfitException.inColumn(c.column(), "\"" + c.value() + "\" is not a number");
            }
            return row -> {
                double x = num.get(row);
                return !Double.isNaN(x) && op.test(Double.compare(x, v));
            };
        }
        if (column instanceof TimeColumn time) {
            byte[] b = bytes(c.value());
            long t = TimeParser.parse(b, 0, b.length);
            if (t == TimeParser.NOT_A_TIME) {
                throw NearfitException.inColumn(c.column(),
                        "\"" + c.value() + "\" is not an ISO 8601 date or date-time such as 2025-03-01T10:20:00Z");
            }
            return row -> {
                long x = time.epochMillis(row);
                return x != TimeColumn.MISSING && op.test(Long.compare(x, t));
            };
        }
        if (column instanceof CategoryColumn cat) {
            if (op != Op.EQ && op != Op.NE) {
                throw NearfitException.inColumn(c.column(), "a category column takes only = and !=, not " + op.symbol());
            }
            int code = cat.codeOf(c.value());
            boolean eq = op == Op.EQ;
            return row -> {
                int x = cat.code(row);
                return x != CategoryColumn.MISSING && (x == code) == eq;
            };
        }
        throw NearfitException.inColumn(c.column(), "a text column cannot be used in a row condition");
    }

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    @Override
    public String toString() {
        return text;
    }
}
