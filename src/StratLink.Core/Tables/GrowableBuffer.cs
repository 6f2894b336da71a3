namespace StratLink.Tables;

/// <summary>An append-only array of unmanaged values that doubles when full; <see cref="ToArray"/> trims it.</summary>
internal sealed class GrowableBuffer<T> where T : unmanaged
{
    private T[] _items = new T[256];

    public int Count { get; private set; }

    public void Add(T item)
    {
        if (Count == _items.Length) Array.Resize(ref _items, _items.Length * 2);
        _items[Count++] = item;
    }

    public T this[int index] => _items[index];

    public T[] ToArray() => _items.AsSpan(0, Count).ToArray();
}
