package dev.annotator.evaluate;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.IOException;
import java.io.Writer;

/**
 * Writes an {@link Evaluation} as one JSON document for pipelines. Field names are snake_case; an undefined
 * measure (zero denominator) is {@code null}. The fields (documented in the evaluate command's help) hold the same
 * numbers as the text table: inputs and {@code feature_type}; {@code records}, each with {@code seqid},
 * {@code length} and {@code length_from}; {@code total}; and in each record and the total {@code tp fp fn tn},
 * {@code sensitivity specificity approximate_correlation}, {@code truth_features predicted_features}, and
 * {@code exact three_prime missed wrong} with their {@code _percent}.
 */
public final class AccuracyJson {
    private static final ObjectMapper MAPPER = new ObjectMapper()
            .enable(SerializationFeature.INDENT_OUTPUT)
            .disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);

    private AccuracyJson() {
    }

    public static void write(Evaluation e, String featureType, Writer out) throws IOException {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("truth", e.truthName());
        root.put("predicted", e.predictedName());
        root.put("feature_type", featureType);
        ArrayNode records = root.putArray("records");
        for (RecordAccuracy r : e.records()) {
            ObjectNode n = records.addObject();
            n.put("seqid", r.seqid());
            n.put("length", r.length());
            n.put("length_from", r.lengthSource().key());
            measures(n, r.accuracy());
        }
        ObjectNode total = root.putObject("total");
        total.put("length", e.totalLength());
        measures(total, e.total());
        MAPPER.writeValue(out, root);
        out.write('\n');
    }

    private static void measures(ObjectNode n, GeneAccuracy a) {
        n.put("tp", a.truePositives());
        n.put("fp", a.falsePositives());
        n.put("fn", a.falseNegatives());
        n.put("tn", a.trueNegatives());
        number(n, "sensitivity", a.sensitivity());
        number(n, "specificity", a.specificity());
        number(n, "approximate_correlation", a.approximateCorrelation());
        n.put("truth_features", a.truthFeatures());
        n.put("predicted_features", a.predictedFeatures());
        n.put("exact", a.exactMatches());
        number(n, "exact_percent", a.exactPercent());
        n.put("three_prime", a.threePrimeMatches());
        number(n, "three_prime_percent", a.threePrimePercent());
        n.put("missed", a.missedFeatures());
        number(n, "missed_percent", a.missedPercent());
        n.put("wrong", a.wrongFeatures());
        number(n, "wrong_percent", a.wrongPercent());
    }

    private static void number(ObjectNode n, String field, double v) {
        if (Double.isNaN(v)) {
            n.putNull(field);
        } else {
            n.put(field, v);
        }
    }
}
