package nearfit.table;

import java.util.List;

/**
 * The missing cells of one column, as a load report lists them.
 *
 * @param column      the column's name
 * @param blank       missing cells that were not bad: empty or a missing-value token
 * @param bad         cells present but not of the column's type, read as missing
 * @param firstLines  the source lines of its first few missing cells, in file order
 * @param blankOnly   whether {@code firstLines} holds blank cells only; false when the column has bad cells
 *                    beyond the loader's examples, so a missing row cannot be told blank or bad
 * @param badExamples the loader's examples of its bad cells, in file order
 */
public record ColumnGaps(String column, long blank, long bad, List<Long> firstLines, boolean blankOnly,
        List<BadCell> badExamples) {
    /** Copies the lists so that the record stays immutable. */
    public ColumnGaps {
        firstLines = List.copyOf(firstLines);
        badExamples = List.copyOf(badExamples);
    }
}
