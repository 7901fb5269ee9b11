namespace Foldwise.Csv.Tests;

public sealed class ZeroRunTests
{
    [Theory]
    [InlineData("0,0,0,5", 10, 3, 6)]
    [InlineData("0,0,0,5", 2, 2, 4)]
    [InlineData("0,0,0,5", 0, 0, 0)]
    [InlineData("0,0", 10, 1, 2)]
    [InlineData("00,0,", 10, 0, 0)]
    [InlineData(",0,", 10, 0, 0)]
    [InlineData("0,,0,", 10, 1, 2)]
    [InlineData("0.5,0,", 10, 0, 0)]
    [InlineData("0,05,", 10, 1, 2)]
    public void Skips_only_fields_written_0_and_ended_by_a_comma(string line, int limit, int fields, int next)
    {
        Assert.Equal((fields, next), (ZeroRun.Skip(line, 0, limit, out int at), at));
    }

    [Fact]
    public void Starts_at_the_given_field()
    {
        Assert.Equal((2, 11), (ZeroRun.Skip("r1,2.5,0,0,7", 7, 10, out int at), at));
    }
}
