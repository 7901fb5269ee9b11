using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;

namespace Foldwise.Cluster.Telemetry;

/// <summary>
/// Where telemetry goes. By default nowhere: OTLP is on when <c>OTEL_EXPORTER_OTLP_ENDPOINT</c> is set (the
/// standard variable; the exporter reads its other <c>OTEL_*</c> settings itself), console output when
/// <c>FOLDWISE_TELEMETRY=console</c>. Tests add their own exporters through the two hooks.
/// </summary>
public sealed record FoldwiseTelemetryOptions
{
    public const string ConsoleVariable = "FOLDWISE_TELEMETRY";
    public const string OtlpVariable = "OTEL_EXPORTER_OTLP_ENDPOINT";

    public bool Console { get; init; }

    public bool Otlp { get; init; }

    /// <summary>The process's name in the telemetry (service.instance.id), e.g. the machine name.</summary>
    public string Instance { get; init; } = Environment.MachineName;

    public Action<TracerProviderBuilder>? Tracing { get; init; }

    public Action<MeterProviderBuilder>? Metrics { get; init; }

    public bool Enabled => Console || Otlp || Tracing is not null || Metrics is not null;

    public static FoldwiseTelemetryOptions FromEnvironment() => new()
    {
        Console = string.Equals(Environment.GetEnvironmentVariable(ConsoleVariable), "console", StringComparison.OrdinalIgnoreCase),
        Otlp = !string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable(OtlpVariable)),
    };
}
