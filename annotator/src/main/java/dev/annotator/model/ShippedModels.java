package dev.annotator.model;

import dev.annotator.error.IoFailureException;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The models packaged in the jar under {@value #RESOURCE_DIR}, one JSON file per model, named after the model.
 * The list of names is fixed here because a jar cannot be listed portably; a test keeps it equal to the
 * top-level models/ folder.
 */
public final class ShippedModels {
    /** Classpath folder of the packaged model files. */
    public static final String RESOURCE_DIR = "dev/annotator/models/";

    /** Names of the shipped models, in the order they are listed. */
    public static final List<String> NAMES = List.of("cpg-island", "bacterial-genes");

    private ShippedModels() {
    }

    /** Every shipped model with its one-line description, read from the packaged files. */
    public static List<ShippedModel> list() {
        List<ShippedModel> out = new ArrayList<>();
        for (String name : NAMES) {
            HmmModel m = load(name).orElseThrow(() -> new IllegalStateException("shipped model " + name
                    + " is missing from the classpath"));
            out.add(new ShippedModel(name, m.description()));
        }
        return out;
    }

    /** The shipped model of that name, or empty when no model of that name is shipped. */
    public static Optional<HmmModel> load(String name) {
        if (!NAMES.contains(name)) {
            return Optional.empty();
        }
        String resource = RESOURCE_DIR + name + ".json";
        try (InputStream in = ShippedModels.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                return Optional.empty();
            }
            return Optional.of(ModelJson.read(in, resource));
        } catch (IOException e) {
            throw new IoFailureException(resource + ": cannot read: " + e.getMessage(), e);
        }
    }
}
