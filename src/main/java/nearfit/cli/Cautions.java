package nearfit.cli;

/** The cautions that end the {@code check} output; the README states the same. */
final class Cautions {
    /** One paragraph, plain words; also the JSON {@code "caution"} string. */
    static final String TEXT = "nearfit is statistical screening, not a protection or safety system. "
            + "A pass is not a clearance to work on equipment, and a flag is a reason to look, not a diagnosis. "
            + "Confirm every finding with the equipment's maintenance procedures, the manufacturer's guidance, "
            + "site rules (isolation and lockout), local codes and qualified personnel.";

    private Cautions() {
    }
}
