package nearfit.table;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;

/**
 * Run in a child JVM by {@link HeapBoundTest}: loads a file and prints the heap the table holds (used heap
 * after a full collection, minus the same before loading), then {@code rows=N}. A second argument lists
 * the columns to keep, comma-separated.
 */
public final class HeapProbe {
    private HeapProbe() {
    }

    public static void main(String[] args) {
        MemoryMXBean mem = ManagementFactory.getMemoryMXBean();
        System.gc();
        long before = mem.getHeapMemoryUsage().getUsed();
        LoadOptions options = args.length > 1
                ? LoadOptions.builder().keepColumns(java.util.List.of(args[1].split(","))).build() : LoadOptions.DEFAULT;
        Table t = CsvLoader.load(args[0], options);
        System.gc();
        long after = mem.getHeapMemoryUsage().getUsed();
        System.out.println("held=" + (after - before) + " rows=" + t.rowCount() + " columns=" + t.columnCount());
    }
}
