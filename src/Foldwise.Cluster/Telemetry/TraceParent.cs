using System.Diagnostics;

namespace Foldwise.Cluster.Telemetry;

/// <summary>A span's context as a W3C <c>traceparent</c> header (version 00), the form a lease carries it across machines in.</summary>
public static class TraceParent
{
    public static string Of(ActivityContext context) =>
        $"00-{context.TraceId.ToHexString()}-{context.SpanId.ToHexString()}-{((context.TraceFlags & ActivityTraceFlags.Recorded) != 0 ? "01" : "00")}";

    /// <summary>The context in <paramref name="text"/>, or none (a root span follows) when it is missing or malformed.</summary>
    public static ActivityContext Parse(string? text) =>
        ActivityContext.TryParse(text, null, isRemote: true, out var context) ? context : default;
}
