namespace StratLink.Tests.ProjectIO;

/// <summary>Project texts for tests; the full one exercises every section of the format description.</summary>
internal static class ProjectFiles
{
    /// <summary>Every section and key of format stratlink-project/1 (fictional site).</summary>
    public const string Full = """
        format: stratlink-project/1
        site:
          name: Mirrowick Fjord
          latitude: 60.12
          longitude: 5.34
        depth_unit: cm
        cores:
          - id: GS-1
            table: cores/GS-1.csv
            depth_column: depth
            signals: [ms, density]
            gaps:
              - [118.0, 121.5]
            disturbed:
              - [0, 4]
          - id: GS-2
            type: gravity
            table: cores/GS-2.csv
            missing_values: [-999]
            sort: true
            sections:
              - {id: "1", top: 0}
              - {id: "2", top: 150.0}
          - id: GS-3
            table: cores/GS-3.txt
            header_line: 3
        markers:
          - id: ash-2
            kind: tephra
            depths: {GS-1: 152.3, GS-2: 141.0, GS-3: 139.4}
            uncertainty: 0.5
        ages:
          - id: c14-1
            kind: radiocarbon
            core: GS-1
            depth: 88.5
            c14_age: 2450
            c14_error: 30
            curve: curves/marine.14c
            reservoir_offset: 120
            reservoir_error: 40
          - id: ash-2-age
            kind: calendar
            marker: ash-2
            age: 4310
            error: 25
          - id: top
            kind: calendar
            core: GS-3
            depth: 0
            age: -68
            error: 1
          - id: floating-varves
            kind: varve-count
            core: GS-2
            table: cores/GS-2-varves.csv
            anchor_depth: 0
            anchor_age: -68
            count_error: 0.02
        alignment:
          reference: GS-1
          signals: {ms: 1.0, density: 0.5}
          window: 0.15
          ensemble: 200
        composite:
          step: 0.5
          splice: auto
        age_model:
          iterations: 2000
          seed: 42
        """;
}
