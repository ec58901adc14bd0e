package dev.annotator.cli;

import dev.annotator.decode.GeneStarts;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

import java.util.Locale;

/** Reads --gene-starts in the lowercase spelling the help shows. */
final class GeneStartsConverter implements ITypeConverter<GeneStarts> {
    @Override
    public GeneStarts convert(String value) {
        return switch (value.toLowerCase(Locale.ROOT)) {
            case "likeliest-start" -> GeneStarts.LIKELIEST_START;
            case "longest-orf" -> GeneStarts.LONGEST_ORF;
            case "decoded" -> GeneStarts.DECODED;
            default -> throw new TypeConversionException("expected likeliest-start, longest-orf or decoded, got '"
                    + value + "'");
        };
    }
}
