package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** Names the exact model an E-step ran with: the SHA-256 of its canonical JSON (see {@link ModelJson#toJson}). */
public final class ModelIdentity {
    private ModelIdentity() {
    }

    public static String sha256(HmmModel model) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                    .digest(ModelJson.toJson(model).getBytes(StandardCharsets.UTF_8)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }
}
