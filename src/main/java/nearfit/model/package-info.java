/**
 * Reference model files and the files the tool writes: a fitted reference saved as a ZIP (the {@code .nfm}
 * model file), read back and checked before it is trusted; the one CSV writer for results; and safe
 * writing of every output. Depends on {@code table} and {@code knn}; the faces depend on it.
 *
 * <h2>Data flow</h2>
 * <pre>
 * KnnModel + leave-one-out flags ─▶ {@link nearfit.model.ReferenceCapture} ─▶ {@link nearfit.model.ReferenceModel}
 *   ─▶ {@link nearfit.model.ModelFile#write} (manifest.json + manifest.sha256 + data/ arrays, through SafeOutput)
 * .nfm ─▶ {@link nearfit.model.ModelArchive} (manifest CRC-32 and SHA-256, then only the needed arrays, each once)
 *   ─▶ ManifestDocument (typed records, JSON through {@link nearfit.model.JsonText}) ─▶ ManifestValues and
 *   StoredRowCheck (every value and array validated) ─▶ ReferenceModel ─▶ {@link nearfit.model.RestoredModel} (the engine, rebuilt)
 * scored rows ─▶ {@link nearfit.model.ResultCsv} (one set of columns, "\n", OWASP neutralising) ─▶ {@link nearfit.model.SafeOutput}
 * </pre>
 *
 * <h2>Usage</h2>
 * <pre>{@code
 * ReferenceModel m = ReferenceCapture.capture(toolVersion, source, engine, looFlags, tuningTable, sampled,
        responseLabels, group, groupLabels, facts);             // facts: each kept row's line and group
 * ModelFile.write(m, Path.of("spring.nfm"), force, inputs);     // never over an input, only regular files
 * RestoredModel r = RestoredModel.of(ModelFile.read(Path.of("spring.nfm")), threads);
 * KnnModel engine = r.engine();                                  // bit for bit the fitted model
 * }</pre>
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li><b>No model is used before it is checked</b>: the manifest against its CRC-32 and its SHA-256, every
 *     value for type and range (a refusal names the file and the field's path), every needed array against
 *     its CRC-32 and SHA-256 and for finite, usable rows. Integrity, not a signature.</li>
 * <li><b>Reading is bounded by the model</b>: only the arrays the manifest needs, each once and exactly as
 *     long as the rows; an unneeded entry is never inflated.</li>
 * <li><b>Stored rows are the engine's kept rows in canonical order</b> with the scaling (and whitening), so
 *     {@code predict} and {@code check} rebuild the index without refitting and reproduce the fit.</li>
 * <li><b>Writes are all or nothing</b>: a temporary file beside the target, renamed when complete, removed
 *     on SIGTERM or Ctrl-C; devices and pipes are written into, never replaced; an input is never a target.</li>
 * <li><b>Format versions</b>: 1.1 adds the digests; 1.0 files are read with every CRC-32 checked; unknown
 *     fields of a 1.x manifest are ignored, another major version is refused.</li>
 * </ul>
 */
package nearfit.model;
