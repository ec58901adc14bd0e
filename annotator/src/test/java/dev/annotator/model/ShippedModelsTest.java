package dev.annotator.model;

import dev.annotator.error.BadInputException;
import dev.annotator.error.MissingInputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class ShippedModelsTest {

    @Test
    void listNamesEachShippedModelWithItsDescription() {
        assertThat(ShippedModels.list()).containsExactly(new ShippedModel("cpg-island",
                "CpG islands in genomic DNA: first-order base composition inside and outside islands"),
                new ShippedModel("bacterial-genes", "Protein-coding genes on both strands (NCBI translation table 11), "
                        + "codon states of order 4"));
    }

    @Test
    void fixedListMatchesTheModelsFolder() throws IOException {
        try (Stream<Path> files = Files.list(ModelFiles.SHIPPED_DIR)) {
            List<String> names = files.map(p -> p.getFileName().toString())
                    .filter(n -> n.endsWith(".json")).map(n -> n.substring(0, n.length() - 5)).sorted().toList();
            assertThat(names).containsExactlyElementsOf(ShippedModels.NAMES.stream().sorted().toList());
        }
    }

    @Test
    void eachShippedModelIsNamedAfterItsFile() {
        for (String name : ShippedModels.NAMES) {
            assertThat(ShippedModels.load(name)).get().extracting(HmmModel::name).isEqualTo(name);
        }
    }

    @Test
    void loadsAShippedModelByName() {
        HmmModel m = ModelLoader.load("cpg-island");
        assertThat(m.name()).isEqualTo("cpg-island");
        assertThat(m.reportedLabels()).extracting(Label::featureType).containsExactly("CpG_island");
    }

    @Test
    void unknownNameIsMissingInput() {
        assertThatThrownBy(() -> ModelLoader.load("cpg-islands"))
                .isInstanceOf(MissingInputException.class)
                .hasMessage("cpg-islands: no such model file or shipped model (shipped: cpg-island, bacterial-genes)");
    }

    @Test
    void loadsAFileByPath(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("mine.json");
        Files.writeString(file, ModelFiles.valid().toString());
        assertThat(ModelLoader.load(file.toString()).name()).isEqualTo("toy");
    }

    @Test
    void anExistingFileWinsOverAShippedName(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("cpg-island"), ModelFiles.valid().toString());
        assertThat(ModelLoader.load("cpg-island", dir).name()).isEqualTo("toy");
    }

    @Test
    void badFileIsNamedAsTheUserWroteIt(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("broken.json"), "{\"format\": \"annotator-hmm/1\",");
        assertThatThrownBy(() -> ModelLoader.load("broken.json", dir))
                .isInstanceOf(BadInputException.class)
                .hasMessageStartingWith("broken.json:1: not valid JSON: ");
    }

    @Test
    void directoryIsNotAModelFile(@TempDir Path dir) {
        assertThatThrownBy(() -> ModelLoader.load(dir.toString()))
                .isInstanceOf(MissingInputException.class)
                .hasMessage(dir + ": is a directory, not a model file");
    }
}
