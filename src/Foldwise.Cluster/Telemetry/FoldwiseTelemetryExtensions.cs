using Microsoft.Extensions.DependencyInjection;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace Foldwise.Cluster.Telemetry;

/// <summary>Registers Foldwise's traces and metrics (and Orleans' meters) with the exporters the options enable; nothing when none is.</summary>
public static class FoldwiseTelemetryExtensions
{
    public static IServiceCollection AddFoldwiseTelemetry(this IServiceCollection services, FoldwiseTelemetryOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (!options.Enabled)
        {
            return services;
        }

        services.AddOpenTelemetry()
            .ConfigureResource(r => r.AddService("foldwise", serviceInstanceId: options.Instance))
            .WithTracing(t =>
            {
                t.AddSource(FoldwiseTelemetry.Name);
                if (options.Otlp)
                {
                    t.AddOtlpExporter();
                }

                if (options.Console)
                {
                    t.AddConsoleExporter();
                }

                options.Tracing?.Invoke(t);
            })
            .WithMetrics(m =>
            {
                m.AddMeter(FoldwiseTelemetry.Name, FoldwiseTelemetry.OrleansMeter);

                // The SDK's default buckets are sized for milliseconds; trials are timed in seconds (TelemetryTests pins these buckets).
                m.AddView(FoldwiseTelemetry.TrialDuration, new ExplicitBucketHistogramConfiguration { Boundaries = FoldwiseTelemetry.DurationBuckets });
                if (options.Otlp)
                {
                    m.AddOtlpExporter();
                }

                if (options.Console)
                {
                    m.AddConsoleExporter();
                }

                options.Metrics?.Invoke(m);
            });
        return services;
    }
}
