using Microsoft.ML.Data;

namespace Foldwise.Learners;

/// <summary>One row as ML.NET reads it: the label (0 for test rows) and the features as a sparse vector.</summary>
internal sealed class SparseFeatureRow
{
    public float Label { get; set; }

    public VBuffer<float> Features { get; set; }
}
