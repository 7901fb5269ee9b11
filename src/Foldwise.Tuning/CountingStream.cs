namespace Foldwise.Tuning;

/// <summary>
/// A write-only stream that passes every write on to <paramref name="inner"/> and tells <paramref name="bytesWritten"/>
/// the bytes written so far (with a total of 0: unknown), so a long encoding can show its progress.
/// </summary>
internal sealed class CountingStream(Stream inner, Action<long, long>? bytesWritten) : Stream
{
    private long written;

    public override bool CanRead => false;

    public override bool CanSeek => false;

    public override bool CanWrite => true;

    public override long Length => written;

    public override long Position
    {
        get => written;
        set => throw new NotSupportedException();
    }

    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    public override void Write(ReadOnlySpan<byte> buffer)
    {
        inner.Write(buffer);
        written += buffer.Length;
        bytesWritten?.Invoke(written, 0);
    }

    public override void Flush() => inner.Flush();

    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();
}
