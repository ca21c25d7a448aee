package nearfit.model;

/** Byte searches for tests that damage a model file at a known place. */
final class Bytes {
    private Bytes() {
    }

    /** The first offset of {@code needle} in {@code hay}; fails the test when it is absent. */
    static int indexOf(byte[] hay, byte[] needle) {
        outer:
        for (int i = 0; i + needle.length <= hay.length; i++) {
            for (int j = 0; j < needle.length; j++) {
                if (hay[i + j] != needle[j]) {
                    continue outer;
                }
            }
            return i;
        }
        throw new AssertionError("pattern not found");
    }
}
